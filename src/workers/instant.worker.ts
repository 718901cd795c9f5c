/// <reference lib="webworker" />
import { expose } from 'comlink';
import { instantComputations } from './instant';

/** The instant worker: outline, live checks, double layer and presets, apart from the solver worker's long solves. */
expose(instantComputations);
