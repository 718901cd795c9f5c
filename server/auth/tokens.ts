import { createSecretKey, type KeyObject } from 'node:crypto';
import type { Request, Response } from 'express';
import jwt from 'jsonwebtoken';
import type { ServerConfig } from '../config';

export const TOKEN_ISSUER = 'osmolane';
export const TOKEN_AUDIENCE = 'osmolane-api';
export const REFRESH_COOKIE = 'osm_refresh';
const REFRESH_PATH = '/api/auth';

/** What an access token says: the user and the session it belongs to (the session must still exist). */
export interface AccessClaims {
  sub: string;
  sid: string;
}

const keys = new Map<string, KeyObject>();

/**
 * The HMAC key as a KeyObject. Given a string, jsonwebtoken first tries to read it as a PEM public or private key
 * on every call, which costs more than the HMAC itself; a KeyObject skips that.
 */
export function tokenKey(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) keys.set(secret, (key = createSecretKey(Buffer.from(secret, 'utf8'))));
  return key;
}

export function signAccessToken(config: ServerConfig, userId: number, sessionId: string): string {
  const claims: AccessClaims = { sub: String(userId), sid: sessionId };
  return jwt.sign(claims, tokenKey(config.tokenSecret), {
    algorithm: 'HS256',
    expiresIn: config.accessTokenSeconds,
    issuer: TOKEN_ISSUER,
    audience: TOKEN_AUDIENCE,
  });
}

/** The refresh cookie holds `<session id>.<secret>`; the session row keeps the secret's hash. */
export function setRefreshCookie(res: Response, config: ServerConfig, sessionId: string, secret: string): void {
  res.cookie(REFRESH_COOKIE, `${sessionId}.${secret}`, {
    httpOnly: true,
    sameSite: 'strict',
    secure: config.publicBaseUrl.startsWith('https:'),
    path: REFRESH_PATH,
    maxAge: config.refreshTokenDays * 86_400_000,
  });
}

export function clearRefreshCookie(res: Response, config: ServerConfig): void {
  res.clearCookie(REFRESH_COOKIE, {
    httpOnly: true,
    sameSite: 'strict',
    secure: config.publicBaseUrl.startsWith('https:'),
    path: REFRESH_PATH,
  });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

export function isSessionId(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

export function readRefreshCookie(req: Request): { sessionId: string; secret: string } | null {
  const raw: unknown = (req.cookies as Record<string, unknown> | undefined)?.[REFRESH_COOKIE];
  if (typeof raw !== 'string') return null;
  const dot = raw.indexOf('.');
  const sessionId = raw.slice(0, dot);
  const secret = raw.slice(dot + 1);
  if (dot < 0 || !isSessionId(sessionId) || !/^[A-Za-z0-9_-]{43}$/.test(secret)) return null;
  return { sessionId, secret };
}
