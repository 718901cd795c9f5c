/** The cut-cell grid: layout in cut-cell-grid.ts. */
export * from './cut-cell-grid';
export { rasterise, MIN_CUT_FRACTION, type GridFrame, type RasteriseOptions, type RasteriseResult } from './rasterise';
export { chooseGrid, cellsForWidth, frameFor, DEFAULT_MAX_CELLS, EXPLICIT_MAX_CELLS, type ChooseGridOptions, type GridChoice } from './choose-grid';
export { coarsen, gridHierarchy } from './coarsen';
export { labelComponents, type FluidComponents } from './components';
export { discretiseDesign, removeComponents, type Discretisation, type DiscretiseOptions } from './discretise';
export { assignPorts, assignZeta, portCuts, PORT_PARALLEL_SIN, type PortSegment } from './boundary-kinds';
export { closureDefect, type ClosureDefect } from './closure';
