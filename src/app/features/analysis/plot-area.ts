import { computed, type Signal } from '@angular/core';
import { hostSize } from '../../ui/host-size';

/** Room around a plot's area for ticks and titles (px). */
export interface PlotMargins {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export interface PlotArea {
  /** The whole plot's width: the host's, measured (the starting width until it has one). */
  width: Signal<number>;
  /** The area inside the margins, at least 40 px each way. */
  innerW: Signal<number>;
  innerH: Signal<number>;
}

/**
 * The size of a plot as wide as its host and `height()` high, and of its area inside the margins (`left()` where
 * the left margin follows the tick labels). Call it in an injection context, e.g. as a component's field.
 */
export function plotArea(m: PlotMargins, startWidth: number, height: () => number, left: () => number = () => m.left): PlotArea {
  const size = hostSize({ w: startWidth, h: 0 });
  const width = computed(() => size().w);
  return {
    width,
    innerW: computed(() => Math.max(40, width() - left() - m.right)),
    innerH: computed(() => Math.max(40, height() - m.top - m.bottom)),
  };
}
