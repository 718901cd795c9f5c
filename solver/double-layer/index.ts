export { capillaryMeanRatio, slitMeanRatio, besselRatioI1I0 } from './finite-edl';
export { edlVelocityRatio, gouyChapmanPotential, gouyChapmanSlope } from './gouy-chapman';
export { solvePoissonBoltzmann } from './poisson-boltzmann';
export { doubleLayer, type DoubleLayerInput, type DoubleLayerReport } from './profile';
