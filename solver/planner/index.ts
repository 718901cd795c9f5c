export { drivesOf, settingsOf, withSettings, type Drive } from '../../shared/drives';
export { unitDesign, unitResponses, type UnitResponses } from './unit-responses';
export { LINEAR_FIELDS, superposeField, superposeFields, superposePorts, type LinearField } from './superpose';
export { planSettings, PlanError, type PlanRequest, type PlanResult, type Target } from './plan';
export { boundedLeastSquares } from './least-squares';
