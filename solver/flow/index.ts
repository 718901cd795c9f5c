/** Depth-averaged Stokes–Brinkman flow with Smoluchowski slip on the cut cells (physics.md §3). */
export { depthFriction, floorLidMobility, flowProblemFromDesign, mobility, type FlowProblem } from './flow-problem';
export { FlowCancelled, solveFlow, type FlowOptions, type FlowSolution } from './solve-flow';
export { flowFields, type FlowFields } from './flow-fields';
export { flowMetrics, type FlowMetrics } from './flow-metrics';
export { cellFieldFromFaces } from './face-field';
export { portFlowRates } from './port-flow';
