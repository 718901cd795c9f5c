export { createRandom, type Random } from './random';
export { createSampler, type Sampler } from './sampler';
export { createWallStepper, type WallStepper } from './walls';
export { histogram, mean, slope, variance } from './statistics';
export { traceBand, type Injection, type Phase, type Species, type TraceFields, type TraceFrame, type TraceOptions, type TraceResult } from './trace';
