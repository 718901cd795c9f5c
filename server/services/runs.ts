import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { RunCreated, RunDetail, RunListItem, RunState, RunSummary } from '../../shared/api';
import { iso, queryRow, queryRows } from '../db/sql';
import { ApiError } from '../errors';
import type { Access } from './access';
import type { ActivityService } from './activity';
import type { BlobStore } from './blob-store';
import type { ListWindow } from './revisions';

interface Row {
  id: number;
  revision_id: number;
  status: RunState;
  settings?: Record<string, unknown>;
  summary: RunSummary;
  blob_key: string | null;
  blob_bytes: number | null;
  created_at: Date;
  author_id: number;
  author_name: string;
}

const BASE64 = /^[A-Za-z0-9+/]*={0,2}$/;

/** Decodes the `fields` of a run strictly: a typo in base64 must not silently store different bytes. */
export function decodeFields(text: string): Buffer {
  if (text.length % 4 !== 0 || !BASE64.test(text)) {
    throw new ApiError('invalid', 'fields must be base64 (RFC 4648, with padding)', 'fields');
  }
  return Buffer.from(text, 'base64');
}

/** Runs of a revision: settings and summary in the table, the field blob in the blob store. */
export class RunService {
  constructor(
    private readonly orm: MikroORM,
    private readonly blobs: BlobStore,
    private readonly activity: ActivityService,
  ) {}

  /**
   * Stores the blob first, then the run row (in a transaction with its activity line); when the row cannot be
   * written the blob is removed again, so no blob is left without a run.
   */
  async create(
    access: Access,
    revisionId: number,
    body: { settings: Record<string, unknown>; summary: RunSummary; fields?: string; status?: RunState },
  ): Promise<RunCreated> {
    const bytes = body.fields === undefined ? null : decodeFields(body.fields);
    const key = bytes ? `runs/${randomUUID()}` : null;
    if (bytes && key) await this.blobs.put(key, bytes);
    try {
      return await this.orm.em.fork().transactional(async (em) => {
        const rev = await queryRow<{ design_id: number; number: number; name: string }>(
          em,
          'select r.design_id, r.number, d.name from revisions r join designs d on d.id = r.design_id where r.id = ?',
          [revisionId],
        );
        if (!rev) throw new ApiError('not-found', 'No such revision');
        const row = await queryRow<RunCreated>(
          em,
          `insert into runs (revision_id, status, settings, summary, blob_key, blob_bytes, created_at, author_id)
           values (?, ?, ?::jsonb, ?::jsonb, ?, ?, now(), ?) returning id`,
          [revisionId, body.status ?? 'solved', JSON.stringify(body.settings), JSON.stringify(body.summary), key, bytes?.length ?? null, access.userId],
        );
        await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId: rev.design_id, kind: 'run.stored', message: `stored a ${body.status ?? 'solved'} run of revision ${rev.number} of "${rev.name}"` });
        return { id: row!.id };
      });
    } catch (err) {
      if (key) await this.blobs.delete(key).catch(() => undefined);
      throw err;
    }
  }

  async list(revisionId: number, q: ListWindow): Promise<{ items: RunListItem[]; total: number }> {
    const em = this.orm.em.fork();
    const dir = q.order === 'asc' ? 'asc' : 'desc';
    const [rows, count] = await Promise.all([
      queryRows<Row>(
        em,
        `select x.id, x.revision_id, x.status, x.summary, x.blob_key, x.blob_bytes, x.created_at, x.author_id, u.name as author_name
         from runs x join users u on u.id = x.author_id where x.revision_id = ?
         order by x.created_at ${dir}, x.id ${dir} limit ? offset ?`,
        [revisionId, q.limit, q.offset],
      ),
      queryRow<{ n: string }>(em, 'select count(*) as n from runs where revision_id = ?', [revisionId]),
    ]);
    return {
      items: rows.map((r) => ({
        id: r.id,
        status: r.status,
        summary: r.summary,
        createdAt: iso(r.created_at),
        author: { id: r.author_id, name: r.author_name },
        hasFields: r.blob_key !== null,
      })),
      total: Number(count?.n ?? 0),
    };
  }

  private async row(runId: number): Promise<Row> {
    const r = await queryRow<Row>(
      this.orm.em.fork(),
      `select x.id, x.revision_id, x.status, x.settings, x.summary, x.blob_key, x.blob_bytes, x.created_at, x.author_id,
         u.name as author_name from runs x join users u on u.id = x.author_id where x.id = ?`,
      [runId],
    );
    if (!r) throw new ApiError('not-found', 'No such run');
    return r;
  }

  async get(runId: number): Promise<RunDetail> {
    const r = await this.row(runId);
    return {
      id: r.id,
      revisionId: r.revision_id,
      status: r.status,
      settings: r.settings ?? {},
      summary: r.summary,
      createdAt: iso(r.created_at),
      author: { id: r.author_id, name: r.author_name },
      hasFields: r.blob_key !== null,
      fieldsBytes: r.blob_bytes,
    };
  }

  async fields(runId: number): Promise<Buffer> {
    const r = await this.row(runId);
    const bytes = r.blob_key ? await this.blobs.get(r.blob_key) : null;
    if (!bytes) throw new ApiError('not-found', 'This run has no stored fields');
    return bytes;
  }
}
