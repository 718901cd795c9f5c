import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody } from '../../../shared/api';

/** What went wrong, in words for the person at the screen. */
export interface Problem {
  status: number;
  code: string | null;
  message: string;
  /** The request field the server named, e.g. `email` or `document.ports[1].potential`. */
  field: string | null;
}

const FALLBACK: Record<number, string> = {
  0: 'The server did not answer. Check the connection and try again.',
  400: 'The server could not accept this input.',
  401: 'Your session has ended. Sign in again.',
  403: 'Your role in this workspace does not allow this.',
  404: 'Not found, or not in a workspace of yours.',
  409: 'Someone changed this in the meantime.',
  413: 'This is larger than the server accepts.',
  429: 'Too many tries. Wait a minute, then try again.',
  500: 'Something went wrong on the server; nothing was changed.',
  502: 'The server is not reachable right now. Try again shortly.',
  503: 'The server is not ready right now. Try again shortly.',
};

/** Reads any error (HTTP or not) into a Problem; the server's own message wins where it is meant for people. */
export function problemOf(err: unknown): Problem {
  if (err instanceof HttpErrorResponse) {
    const body = err.error as Partial<ApiErrorBody> | null;
    const apiError = body && typeof body === 'object' && body.error && typeof body.error === 'object' ? body.error : null;
    const status = err.status;
    const fallback = FALLBACK[status] ?? (status >= 500 ? FALLBACK[500] : FALLBACK[400]);
    // 401/403/404 keep our wording: they must not depend on, or reveal, more than the status says.
    const useServerText = apiError?.message && ![401, 403, 404].includes(status) && status < 500;
    return {
      status,
      code: apiError?.code ?? null,
      message: useServerText ? apiError.message : fallback,
      field: apiError?.field ?? null,
    };
  }
  if (err instanceof Error) return { status: -1, code: null, message: err.message, field: null };
  return { status: -1, code: null, message: 'Something went wrong.', field: null };
}

/** The message alone. */
export function errorMessage(err: unknown): string {
  return problemOf(err).message;
}

/**
 * Puts a server refusal that names a field onto that form control (as the `server` error), so the message shows
 * beside the input. Returns true when it found the control; otherwise show the message elsewhere.
 */
export function showOnField(form: FormGroup, err: unknown, fieldMap: Record<string, string> = {}): boolean {
  const problem = problemOf(err);
  if (!problem.field) return false;
  const name = fieldMap[problem.field] ?? problem.field;
  const control: AbstractControl | null = form.get(name);
  if (!control) return false;
  control.setErrors({ ...(control.errors ?? {}), server: withoutFieldName(problem.message, problem.field) });
  control.markAsTouched();
  return true;
}

/** "password: must be at least 8 characters" → "Must be at least 8 characters" (shown beside that very field). */
export function withoutFieldName(message: string, field: string): string {
  for (const prefix of [`${field}: `, `${field} `]) {
    if (message.startsWith(prefix)) {
      const rest = message.slice(prefix.length);
      return rest.charAt(0).toUpperCase() + rest.slice(1);
    }
  }
  return message;
}
