export { COMPARE_PARTICLES, compareDrives, type BandSetup, type BandSpreading, type CompareOptions, type Comparison, type ComparisonSide, type Segment } from './compare';
