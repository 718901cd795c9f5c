import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { ApplicationConfig, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, type MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { createInstantWorker } from '../workers/instant-worker-factory';
import { createSolverWorker } from '../workers/solver-worker-factory';
import { routes } from './app.routes';
import { authInterceptor } from './core/auth-interceptor';
import { INSTANT, instantGeometryChecks } from './core/instant-client';
import { SOLVER } from './core/solver-client';
import { GEOMETRY_CHECKS } from './features/sketch/live-checks';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    provideHttpClient(withFetch(), withInterceptors([authInterceptor])),
    { provide: SOLVER, useFactory: createSolverWorker },
    // Outlines, live checks, double layer and presets: a small worker of their own, free while a solve runs.
    { provide: INSTANT, useFactory: createInstantWorker },
    { provide: GEOMETRY_CHECKS, useFactory: instantGeometryChecks },
    // Outlined fields keep their labels at the dense setting of our theme (filled ones hide them below density -1).
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline' } satisfies MatFormFieldDefaultOptions },
  ],
};
