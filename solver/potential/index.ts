/** The electric potential on the cut cells and what follows from it (physics.md §2). */
export { laplaceOperator, portFluxes, portRightHandSide } from './assemble';
export { electrodePieces, type ElectrodePieces } from './electrode-pieces';
export { electricField, type CellField } from './gradient';
export { electrodePower, fieldPower, maxPowerPerLength } from './joule';
export { MIN_PORT_DISTANCE, portConductances } from './port-conductance';
export { PotentialCancelled, solvePotential, type PotentialOptions, type PotentialSolution } from './potential-solve';
