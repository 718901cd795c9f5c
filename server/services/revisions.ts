import type { MikroORM } from '@mikro-orm/postgresql';
import type { Comment, RevisionCreated, RevisionDetail, RevisionSummary } from '../../shared/api';
import { iso, queryRow, queryRows } from '../db/sql';
import { ApiError } from '../errors';
import type { Access } from './access';
import type { ActivityService } from './activity';

interface RevisionRow {
  id: number;
  design_id: number;
  number: number;
  note: string;
  document?: unknown;
  created_at: Date;
  author_id: number;
  author_name: string;
}

interface CommentRow {
  id: number;
  body: string;
  at: [number, number] | null;
  created_at: Date;
  author_id: number;
  author_name: string;
}

function revisionSummary(r: RevisionRow): RevisionSummary {
  return { id: r.id, number: r.number, note: r.note, createdAt: iso(r.created_at), author: { id: r.author_id, name: r.author_name } };
}

export interface ListWindow {
  limit: number;
  offset: number;
  order: 'asc' | 'desc';
}

/**
 * Revisions (frozen copies of a design's document; this service only ever inserts them, and a trigger in the
 * database refuses any UPDATE) and the comments on them.
 */
export class RevisionService {
  constructor(
    private readonly orm: MikroORM,
    private readonly activity: ActivityService,
  ) {}

  /** Freezes the design's current document as the next revision; the design row lock keeps numbers unique. */
  async create(access: Access, designId: number, note: string): Promise<RevisionCreated> {
    return this.orm.em.fork().transactional(async (em) => {
      const design = await queryRow<{ name: string; version: number }>(em, 'select name, version from designs where id = ? for update', [designId]);
      if (!design) throw new ApiError('not-found', 'No such design');
      const row = await queryRow<RevisionCreated>(
        em,
        `insert into revisions (design_id, number, note, document, created_at, author_id)
         select d.id, coalesce((select max(number) from revisions where design_id = d.id), 0) + 1, ?, d.document, now(), ?
         from designs d where d.id = ? returning id, number`,
        [note, access.userId, designId],
      );
      const what = note ? `: ${note}` : '';
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId, kind: 'revision.created', message: `made revision ${row!.number} of "${design.name}" (version ${design.version})${what}` });
      return row!;
    });
  }

  async list(designId: number, q: ListWindow): Promise<{ items: RevisionSummary[]; total: number }> {
    const em = this.orm.em.fork();
    const dir = q.order === 'asc' ? 'asc' : 'desc';
    const [rows, count] = await Promise.all([
      queryRows<RevisionRow>(
        em,
        `select r.id, r.design_id, r.number, r.note, r.created_at, r.author_id, u.name as author_name
         from revisions r join users u on u.id = r.author_id where r.design_id = ? order by r.number ${dir} limit ? offset ?`,
        [designId, q.limit, q.offset],
      ),
      queryRow<{ n: string }>(em, 'select count(*) as n from revisions where design_id = ?', [designId]),
    ]);
    return { items: rows.map(revisionSummary), total: Number(count?.n ?? 0) };
  }

  async get(revisionId: number): Promise<RevisionDetail> {
    const r = await queryRow<RevisionRow>(
      this.orm.em.fork(),
      `select r.id, r.design_id, r.number, r.note, r.document, r.created_at, r.author_id, u.name as author_name
       from revisions r join users u on u.id = r.author_id where r.id = ?`,
      [revisionId],
    );
    if (!r) throw new ApiError('not-found', 'No such revision');
    return { ...revisionSummary(r), designId: r.design_id, document: r.document };
  }

  async comments(revisionId: number, q: ListWindow): Promise<{ items: Comment[]; total: number }> {
    const em = this.orm.em.fork();
    const dir = q.order === 'desc' ? 'desc' : 'asc';
    const [rows, count] = await Promise.all([
      queryRows<CommentRow>(
        em,
        `select c.id, c.body, c.at, c.created_at, c.author_id, u.name as author_name
         from comments c join users u on u.id = c.author_id where c.revision_id = ?
         order by c.created_at ${dir}, c.id ${dir} limit ? offset ?`,
        [revisionId, q.limit, q.offset],
      ),
      queryRow<{ n: string }>(em, 'select count(*) as n from comments where revision_id = ?', [revisionId]),
    ]);
    return {
      items: rows.map((c) => ({ id: c.id, body: c.body, at: c.at ?? null, createdAt: iso(c.created_at), author: { id: c.author_id, name: c.author_name } })),
      total: Number(count?.n ?? 0),
    };
  }

  async addComment(access: Access, revisionId: number, body: string, at: [number, number] | null): Promise<Comment> {
    return this.orm.em.fork().transactional(async (em) => {
      const rev = await queryRow<{ design_id: number; number: number; name: string }>(
        em,
        'select r.design_id, r.number, d.name from revisions r join designs d on d.id = r.design_id where r.id = ?',
        [revisionId],
      );
      if (!rev) throw new ApiError('not-found', 'No such revision');
      const row = await queryRow<CommentRow>(
        em,
        `insert into comments (revision_id, author_id, body, at, created_at) values (?, ?, ?, ?::jsonb, now())
         returning id, body, at, created_at, author_id, (select name from users where id = author_id) as author_name`,
        [revisionId, access.userId, body, at ? JSON.stringify(at) : null],
      );
      const preview = body.length > 80 ? `${body.slice(0, 77)}...` : body;
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId: rev.design_id, kind: 'comment.added', message: `commented on revision ${rev.number} of "${rev.name}": ${preview}` });
      return { id: row!.id, body: row!.body, at: row!.at ?? null, createdAt: iso(row!.created_at), author: { id: row!.author_id, name: row!.author_name } };
    });
  }
}
