import { z } from 'zod';
import type { Services } from '../services';
import { idParam, parse, sendList, type ApiRoutes } from './define';
import * as schema from './schemas';

const memberQuery = schema.listQuery(['name', 'email', 'role'], { sort: 'name', order: 'asc', limit: 200, maxLimit: 1000 });
const invitationQuery = schema.listQuery(['createdAt'], { sort: 'createdAt', order: 'desc', limit: 200, maxLimit: 1000 });
const activityQuery = schema
  .listQuery(['createdAt'], { sort: 'createdAt', order: 'desc', limit: 50, maxLimit: 200 })
  .extend({ designId: z.coerce.number().int().positive().optional() });

/** Workspaces, members, invitations (owner) and the activity log. */
export function workspaceRoutes(api: ApiRoutes, s: Services): void {
  api.user('get', '/workspaces', async (_req, res, user) => {
    res.json(await s.workspaces.listFor(user.id));
  });

  api.user('post', '/workspaces', async (req, res, user) => {
    const body = parse(schema.createWorkspace, req.body);
    res.status(201).json(await s.workspaces.create(user.id, body.name));
  });

  api.user('get', '/workspaces/:wid', async (req, res, user) => {
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'viewer');
    res.json(await s.workspaces.get(access));
  });

  api.user('get', '/workspaces/:wid/members', async (req, res, user) => {
    const q = parse(memberQuery, req.query, 'The query');
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'viewer');
    sendList(res, await s.workspaces.members(access.workspaceId, q));
  });

  api.user('patch', '/workspaces/:wid/members/:userId', async (req, res, user) => {
    const body = parse(schema.changeRole, req.body);
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'owner');
    res.json(await s.workspaces.changeRole(access, idParam(req, 'userId'), body.role));
  });

  // Owners remove members; anyone may remove themselves (leave).
  api.user('delete', '/workspaces/:wid/members/:userId', async (req, res, user) => {
    const target = idParam(req, 'userId');
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), target === user.id ? 'viewer' : 'owner');
    await s.workspaces.removeMember(access, target);
    res.status(204).end();
  });

  api.user('get', '/workspaces/:wid/invitations', async (req, res, user) => {
    const q = parse(invitationQuery, req.query, 'The query');
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'owner');
    sendList(res, await s.invitations.list(access.workspaceId, q));
  });

  api.user('post', '/workspaces/:wid/invitations', async (req, res, user) => {
    const body = parse(schema.invite, req.body);
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'owner');
    res.status(201).json(await s.invitations.invite(access, user, body.email, body.role));
  });

  api.user('delete', '/workspaces/:wid/invitations/:id', async (req, res, user) => {
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'owner');
    await s.invitations.revoke(access, idParam(req, 'id'));
    res.status(204).end();
  });

  api.user('get', '/workspaces/:wid/activity', async (req, res, user) => {
    const q = parse(activityQuery, req.query, 'The query');
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'viewer');
    res.json(await s.activity.list(access.workspaceId, q));
  });
}
