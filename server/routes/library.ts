import type { Services } from '../services';
import { idParam, parse, sendList, type ApiRoutes } from './define';
import * as schema from './schemas';

const libraryQuery = schema
  .listQuery(['kind', 'name'], { sort: 'kind', order: 'asc', limit: 500, maxLimit: 1000 })
  .extend({ kind: schema.libraryKind.optional() });

/** The library: built-in entries (read-only) and the workspace's own buffers and wall materials (editors write). */
export function libraryRoutes(api: ApiRoutes, s: Services): void {
  api.user('get', '/workspaces/:wid/library', async (req, res, user) => {
    const q = parse(libraryQuery, req.query, 'The query');
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'viewer');
    sendList(res, await s.library.list(access.workspaceId, q));
  });

  api.user('post', '/workspaces/:wid/library', async (req, res, user) => {
    const body = parse(schema.libraryItem, req.body);
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'editor');
    res.status(201).json(await s.library.create(access, body));
  });

  api.user('put', '/library/:id', async (req, res, user) => {
    const body = parse(schema.libraryItem, req.body);
    const id = idParam(req, 'id');
    const access = await s.access.libraryItem(user.id, id, 'editor');
    res.json(await s.library.update(access, id, body));
  });

  api.user('delete', '/library/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    const access = await s.access.libraryItem(user.id, id, 'editor');
    await s.library.remove(access, id);
    res.status(204).end();
  });
}
