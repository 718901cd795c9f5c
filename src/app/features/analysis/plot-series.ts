/** One line of a plot: x and y in SI; NaN leaves a gap. Plain data: the workers build series too. */
export interface PlotSeries {
  label: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Line style: the first series solid in the primary colour, others by their own. */
  tone?: 'primary' | 'tertiary' | 'secondary' | 'neutral';
  dashed?: boolean;
}
