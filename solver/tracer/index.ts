export { createRandom, type Random } from './random';
export { createSampler, type Sampler } from './sampler';
export { createWallStepper, type WallStepper } from './walls';
export { histogram, mean, slope, variance } from './statistics';
export { traceBand, type Injection, type Phase, type Species, type TraceFields, type TraceFrame, type TraceOptions, type TraceResult } from './trace';
export { floorLidMobility, gridForSolve, traceFieldsOf } from './trace-fields';
export { phaseDesign, pilotArrivals, runTrace, type PhaseSpec, type TraceRequest, type TraceRun } from './protocol';
export { guessCrossRoles, pinchedPlug, type CrossRoles, type PinchedPlug } from './pinched';
