/**
 * Why a solve did not give a result, as data the command line, worker and server can show
 * without a stack trace.
 *   refused:   the design or an option is invalid (the command line exits 2);
 *   cancelled: shouldStop() said so;
 *   internal:  a bug or an unexpected failure (exit 1).
 */
import type { DesignFieldError, DesignProblem, DesignProblemCode } from '../../shared/design';

export type SolveErrorCode = 'invalid-design' | 'invalid-option' | DesignProblemCode | 'cancelled' | 'internal';
export type SolveErrorKind = 'refused' | 'cancelled' | 'internal';

export interface SolveErrorDetail {
  code?: string;
  field?: string;
  message: string;
}

export class SolveError extends Error {
  readonly code: SolveErrorCode;
  readonly kind: SolveErrorKind;
  /** The design field concerned, when there is one (e.g. `ports[1].potential`). */
  readonly field?: string;
  /** Every problem found, the first of which is `message`. */
  readonly details: SolveErrorDetail[];

  constructor(code: SolveErrorCode, message: string, options: { field?: string; details?: SolveErrorDetail[] } = {}) {
    super(message);
    this.name = 'SolveError';
    this.code = code;
    this.kind = code === 'cancelled' ? 'cancelled' : code === 'internal' ? 'internal' : 'refused';
    this.field = options.field;
    this.details = options.details ?? [{ code, field: options.field, message }];
  }

  toJSON(): { code: string; message: string; field?: string } {
    return this.field === undefined ? { code: this.code, message: this.message } : { code: this.code, message: this.message, field: this.field };
  }
}

/** `ports[1].potential` + `must be a number` → `ports[1].potential must be a number`. */
function fieldSentence(e: DesignFieldError): string {
  return e.field === '' ? `design: ${e.message}` : `${e.field} ${e.message}`;
}

function withMore(first: string, more: number): string {
  return more > 0 ? `${first} (and ${more} more problem${more === 1 ? '' : 's'})` : first;
}

export function invalidDesign(errors: ReadonlyArray<DesignFieldError>): SolveError {
  const first = errors[0] ?? { field: '', message: 'is not a valid design' };
  return new SolveError('invalid-design', withMore(fieldSentence(first), errors.length - 1), {
    field: first.field || undefined,
    details: errors.map((e) => ({ code: 'invalid-design', field: e.field || undefined, message: fieldSentence(e) })),
  });
}

export function geometryRefusal(problems: ReadonlyArray<DesignProblem>): SolveError {
  const errors = problems.filter((p) => p.severity === 'error');
  const first = errors[0];
  return new SolveError(first.code, withMore(first.message, errors.length - 1), {
    field: first.field,
    details: errors.map((p) => ({ code: p.code, field: p.field, message: p.message })),
  });
}

/** Any thrown value as a SolveError (unexpected ones become `internal`). */
export function asSolveError(error: unknown): SolveError {
  if (error instanceof SolveError) return error;
  const text = error instanceof Error ? error.message : String(error);
  return new SolveError('internal', `internal failure: ${text.split('\n')[0]}`);
}
