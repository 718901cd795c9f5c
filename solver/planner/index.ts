export { drivesOf, settingsOf, unitDesign, unitResponses, type Drive, type UnitResponses } from './unit-responses';
export { LINEAR_FIELDS, superposeField, superposeFields, superposePorts, type LinearField } from './superpose';
export { planSettings, withSettings, PlanError, type PlanRequest, type PlanResult, type Target } from './plan';
export { boundedLeastSquares } from './least-squares';
