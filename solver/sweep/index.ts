export { maxAbs, pointDocument, pointResult, solvePoint } from './point';
export { superposable, superposedSweep, type SuperposedSweep } from './superposed';
