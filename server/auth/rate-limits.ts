import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { RateLimit } from '../config';
import { ApiError } from '../errors';

/**
 * A per-address limit for the sign-in and reset routes; 429 with api.md's error body when exceeded.
 * With `failuresOnly`, answers below 400 do not count (people who type their password right are never slowed).
 */
export function limitRequests(limit: RateLimit, what: string, failuresOnly = false): RequestHandler {
  const minutes = Math.max(1, Math.ceil(limit.windowMs / 60_000));
  return rateLimit({
    windowMs: limit.windowMs,
    limit: limit.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    skipSuccessfulRequests: failuresOnly,
    handler: (_req, _res, next) => {
      next(new ApiError('rate-limited', `Too many ${what} from this address; try again in ${minutes} minute${minutes === 1 ? '' : 's'}`));
    },
  });
}
