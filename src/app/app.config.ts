import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { ApplicationConfig, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, type MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { createSolverWorker } from '../workers/solver-worker-factory';
import { routes } from './app.routes';
import { authInterceptor } from './core/auth-interceptor';
import { SOLVER, workerGeometryChecks } from './core/solver-client';
import { GEOMETRY_CHECKS } from './features/sketch/live-checks';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    provideHttpClient(withFetch(), withInterceptors([authInterceptor])),
    { provide: SOLVER, useFactory: createSolverWorker },
    // The sketch's live geometry checks run in the solver worker.
    { provide: GEOMETRY_CHECKS, useFactory: workerGeometryChecks },
    // Outlined fields keep their labels at the dense setting of our theme (filled ones hide them below density -1).
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline' } satisfies MatFormFieldDefaultOptions },
  ],
};
