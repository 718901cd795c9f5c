/** What the solver worker offers the page (through comlink). */
export interface SolverApi {
  hello(): Promise<{ ready: boolean; at: number }>;
}
