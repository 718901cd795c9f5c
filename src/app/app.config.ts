import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { ApplicationConfig, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, type MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { createSolverWorker } from '../workers/solver-worker-factory';
import { routes } from './app.routes';
import { authInterceptor } from './core/auth-interceptor';
import { SOLVER } from './core/solver-client';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    provideHttpClient(withFetch(), withInterceptors([authInterceptor])),
    { provide: SOLVER, useFactory: createSolverWorker },
    // Outlined fields keep their labels at the dense setting of our theme (filled ones hide them below density -1).
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline' } satisfies MatFormFieldDefaultOptions },
  ],
};
