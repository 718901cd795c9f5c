import { InjectionToken } from '@angular/core';
import type { Remote } from 'comlink';
import type { SolverApi } from '../../workers/solver-api';

/** The solver worker as the app sees it; tests provide a fake with useValue. */
export const SOLVER = new InjectionToken<Remote<SolverApi>>('Osmolane solver worker');
