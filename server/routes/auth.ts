import type { Response } from 'express';
import type { SignInResponse } from '../../shared/api';
import { limitRequests } from '../auth/rate-limits';
import { clearRefreshCookie, readRefreshCookie, setRefreshCookie } from '../auth/tokens';
import type { ServerConfig } from '../config';
import { ApiError } from '../errors';
import type { Services } from '../services';
import type { Grant } from '../services/auth';
import { parse, type ApiRoutes } from './define';
import * as schema from './schemas';

/** Answers a sign-in-like request: the access token in the body, the refresh secret in the httpOnly cookie. */
export function sendGrant(res: Response, config: ServerConfig, grant: Grant, status = 200): void {
  if (grant.refresh) setRefreshCookie(res, config, grant.refresh.sessionId, grant.refresh.secret);
  res.setHeader('Cache-Control', 'no-store');
  const body: SignInResponse = { token: grant.token, user: grant.user, expiresIn: grant.expiresIn };
  res.status(status).json(body);
}

/** Sign-in, sign-up, refresh, sign-out, passwords, and invitations opened from a mailed link. */
export function authRoutes(api: ApiRoutes, s: Services, config: ServerConfig): void {
  const signInLimit = limitRequests(config.rateLimits.signIn, 'failed sign-ins', true);
  const resetRequestLimit = limitRequests(config.rateLimits.reset, 'password-reset requests');
  const resetLimit = limitRequests(config.rateLimits.reset, 'failed password resets', true);
  const signUpLimit = limitRequests(config.rateLimits.reset, 'new accounts');

  api.open(
    'post',
    '/auth/sign-in',
    async (req, res) => {
      const body = parse(schema.signIn, req.body);
      sendGrant(res, config, await s.auth.signIn(body.email, body.password));
    },
    signInLimit,
  );

  api.open(
    'post',
    '/auth/sign-up',
    async (req, res) => {
      const body = parse(schema.signUp, req.body);
      sendGrant(res, config, await s.auth.signUp(body.email, body.name, body.password), 201);
    },
    signUpLimit,
  );

  api.open('post', '/auth/refresh', async (req, res) => {
    const cookie = readRefreshCookie(req);
    if (!cookie) throw new ApiError('not-signed-in', 'No session to refresh; sign in');
    try {
      sendGrant(res, config, await s.auth.refresh(cookie.sessionId, cookie.secret));
    } catch (err) {
      clearRefreshCookie(res, config);
      throw err;
    }
  });

  api.open(
    'post',
    '/auth/sign-out',
    async (req, res) => {
      const sessions = new Set<string>();
      if (req.user) sessions.add(req.user.sessionId);
      const cookie = readRefreshCookie(req);
      if (cookie) sessions.add(cookie.sessionId);
      for (const id of sessions) await s.auth.signOut(id);
      clearRefreshCookie(res, config);
      res.status(204).end();
    },
    api.auth.peekUser,
  );

  api.user('post', '/auth/password', async (req, res, user) => {
    const body = parse(schema.changePassword, req.body);
    await s.auth.changePassword(user, body.currentPassword, body.newPassword);
    res.status(204).end();
  });

  api.open(
    'post',
    '/auth/reset-request',
    async (req, res) => {
      const body = parse(schema.resetRequest, req.body);
      await s.auth.requestReset(body.email);
      res.status(202).json({ status: 'accepted' });
    },
    resetRequestLimit,
  );

  api.open(
    'post',
    '/auth/reset',
    async (req, res) => {
      const body = parse(schema.reset, req.body);
      await s.auth.resetPassword(body.token, body.newPassword);
      res.status(204).end();
    },
    resetLimit,
  );

  api.user('get', '/me', async (_req, res, user) => {
    res.json(await s.auth.me(user.id));
  });

  api.open('get', '/invitations/:token', async (req, res) => {
    res.json(await s.invitations.preview(String(req.params['token'])));
  });

  api.open(
    'post',
    '/invitations/:token/accept',
    async (req, res) => {
      const body = parse(schema.accept, req.body ?? {});
      sendGrant(res, config, await s.invitations.accept(String(req.params['token']), body, req.user));
    },
    signInLimit,
    // A stale token from an earlier session is no proof either way; the password in the body still is.
    api.auth.peekUser,
  );
}
