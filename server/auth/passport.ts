import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { ServerConfig } from '../config';
import { ApiError } from '../errors';
import { isSessionId, TOKEN_AUDIENCE, TOKEN_ISSUER, tokenKey, type AccessClaims } from './tokens';

/** The person behind a request's access token. */
export interface SignedInUser {
  id: number;
  email: string;
  name: string;
  sessionId: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport types `req.user` as Express.User.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SignedInUser {}
  }
}

/** Finds the still-open session of an access token; null once the session has ended. */
export type SessionLookup = (sessionId: string, userId: number) => Promise<SignedInUser | null>;

export interface AuthMiddleware {
  /** 401 unless the request carries a valid access token of an open session. */
  requireUser: RequestHandler;
  /** Sets req.user for a valid token and passes every request on (sign-out and accepting an invitation). */
  peekUser: RequestHandler;
}

/** passport-jwt (HS256) on a passport instance of our own, with answers in api.md's error shape. */
export function createAuthMiddleware(config: ServerConfig, findSession: SessionLookup): AuthMiddleware {
  const passport = new Passport();
  passport.use(
    'jwt',
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        // A KeyObject (see tokenKey); passport-jwt hands it to jsonwebtoken as is, its types just do not say so.
        secretOrKeyProvider: (_req, _raw, done) => done(null, tokenKey(config.tokenSecret) as unknown as Buffer),
        algorithms: ['HS256'],
        issuer: TOKEN_ISSUER,
        audience: TOKEN_AUDIENCE,
      },
      (claims: Partial<AccessClaims>, done: (err: unknown, user?: SignedInUser | false) => void) => {
        const userId = Number(claims.sub);
        if (!Number.isSafeInteger(userId) || !isSessionId(claims.sid)) return done(null, false);
        findSession(claims.sid, userId).then(
          (user) => done(null, user ?? false),
          (err: unknown) => done(err),
        );
      },
    ),
  );

  const authenticate = (mode: 'require' | 'peek'): RequestHandler => (req, res, next) => {
    if (mode !== 'require' && !req.headers.authorization) return next();
    const handler = passport.authenticate('jwt', { session: false }, (err: unknown, user: SignedInUser | false) => {
      if (err) return next(err);
      if (!user && mode === 'peek') return next();
      if (!user) return next(new ApiError('not-signed-in', 'Sign in first: the access token is missing, expired or no longer valid'));
      req.user = user;
      next();
    }) as RequestHandler;
    handler(req, res, next);
  };
  return { requireUser: authenticate('require'), peekUser: authenticate('peek') };
}
