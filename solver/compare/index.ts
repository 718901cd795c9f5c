export { compareDrives, type Comparison, type ComparisonSide } from './compare';
