import type { Services } from '../services';
import { idParam, parse, sendList, type ApiRoutes } from './define';
import * as schema from './schemas';
import { z } from 'zod';

const designQuery = schema
  .listQuery(['updatedAt', 'name', 'reviewState'], { sort: 'updatedAt', order: 'desc', limit: 50, maxLimit: 200 })
  .extend({ q: z.string().trim().max(200).optional() });
const revisionQuery = schema.listQuery(['number'], { sort: 'number', order: 'desc', limit: 200, maxLimit: 1000 });
const runQuery = schema.listQuery(['createdAt'], { sort: 'createdAt', order: 'desc', limit: 200, maxLimit: 1000 });
const commentQuery = schema.listQuery(['createdAt'], { sort: 'createdAt', order: 'asc', limit: 500, maxLimit: 1000 });

/** Designs, review states, revisions, comments and runs. Viewers read; reviewers also comment and review; editors write. */
export function designRoutes(api: ApiRoutes, s: Services): void {
  api.user('get', '/workspaces/:wid/designs', async (req, res, user) => {
    const q = parse(designQuery, req.query, 'The query');
    // The viewer check rides on the list's query (DesignService.list); the same answers as s.access.workspace.
    res.json(await s.designs.list(user.id, idParam(req, 'wid'), q));
  });

  api.user('post', '/workspaces/:wid/designs', async (req, res, user) => {
    const body = parse(schema.createDesign, req.body);
    const access = await s.access.workspace(user.id, idParam(req, 'wid'), 'editor');
    res.status(201).json(await s.designs.create(access, body.name, body.document));
  });

  api.user('get', '/designs/:id', async (req, res, user) => {
    // The viewer check rides on the read (DesignService.read); the same answers as s.access.design.
    res.json(await s.designs.read(user.id, idParam(req, 'id')));
  });

  api.user('put', '/designs/:id', async (req, res, user) => {
    const body = parse(schema.saveDesign, req.body);
    const id = idParam(req, 'id');
    const access = await s.access.design(user.id, id, 'editor');
    res.json(await s.designs.save(access, id, body));
  });

  api.user('post', '/designs/:id/review', async (req, res, user) => {
    const body = parse(schema.review, req.body);
    const id = idParam(req, 'id');
    const access = await s.access.design(user.id, id, 'reviewer');
    res.json(await s.designs.review(access, user, id, body.state));
  });

  api.user('post', '/designs/:id/revisions', async (req, res, user) => {
    const body = parse(schema.createRevision, req.body ?? {});
    const id = idParam(req, 'id');
    const access = await s.access.design(user.id, id, 'editor');
    res.status(201).json(await s.revisions.create(access, id, body.note));
  });

  api.user('get', '/designs/:id/revisions', async (req, res, user) => {
    const q = parse(revisionQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.design(user.id, id, 'viewer');
    sendList(res, await s.revisions.list(id, q));
  });

  api.user('get', '/revisions/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.revision(user.id, id, 'viewer');
    res.json(await s.revisions.get(id));
  });

  api.user('get', '/revisions/:id/comments', async (req, res, user) => {
    const q = parse(commentQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.revision(user.id, id, 'viewer');
    sendList(res, await s.revisions.comments(id, q));
  });

  api.user('post', '/revisions/:id/comments', async (req, res, user) => {
    const body = parse(schema.createComment, req.body);
    const id = idParam(req, 'id');
    const access = await s.access.revision(user.id, id, 'reviewer');
    res.status(201).json(await s.revisions.addComment(access, id, body.body, body.at ?? null));
  });

  api.user('post', '/revisions/:id/runs', async (req, res, user) => {
    const body = parse(schema.createRun, req.body);
    const id = idParam(req, 'id');
    const access = await s.access.revision(user.id, id, 'editor');
    res.status(201).json(await s.runs.create(access, id, body));
  });

  api.user('get', '/revisions/:id/runs', async (req, res, user) => {
    const q = parse(runQuery, req.query, 'The query');
    const id = idParam(req, 'id');
    await s.access.revision(user.id, id, 'viewer');
    sendList(res, await s.runs.list(id, q));
  });

  api.user('get', '/runs/:id', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.run(user.id, id, 'viewer');
    res.json(await s.runs.get(id));
  });

  api.user('get', '/runs/:id/fields', async (req, res, user) => {
    const id = idParam(req, 'id');
    await s.access.run(user.id, id, 'viewer');
    const bytes = await s.runs.fields(id);
    res.setHeader('Content-Type', 'application/octet-stream');
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.send(bytes);
  });
}
