import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ERROR_STATUS, type ApiErrorBody, type ErrorCode } from '../shared/api';

/** The one error type of the server; routes and services throw it, the error handler maps it to api.md's shape. */
export class ApiError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toBody(): ApiErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.field ? { field: this.field } : {}) } };
  }
}

export const notFoundRoute: RequestHandler = (req, _res, next) => {
  next(new ApiError('not-found', `No route ${req.method} ${req.path}`));
};

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
}

/** Maps anything thrown to `{ error: { code, message, field? } }` with the right status. */
export function errorHandler(log: (message: string) => void = console.error): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    let apiError: ApiError;
    if (err instanceof ApiError) {
      apiError = err;
    } else {
      const e = err as HttpishError;
      const status = e.status ?? e.statusCode;
      if (e.type === 'entity.too.large' || status === 413) {
        apiError = new ApiError('too-large', 'The request body is larger than the server accepts');
      } else if (e.type === 'entity.parse.failed') {
        apiError = new ApiError('invalid', 'The request body is not valid JSON');
      } else if (status && status >= 400 && status < 500 && e.expose) {
        apiError = new ApiError('invalid', e.message ?? 'Bad request');
      } else {
        log(`[error] ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
        apiError = new ApiError('internal', 'Something went wrong on the server; the request was not completed');
      }
    }
    if (res.headersSent) return;
    res.status(apiError.status).json(apiError.toBody());
  };
}
