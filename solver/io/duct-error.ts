/** The depth-averaged model's error against the exact duct lives in shared/ (the app shows it too). */
export { brinkmanFactor, ductError, exactDuctFactor, type DuctError } from '../../shared/duct-model';
