import type { MikroORM } from '@mikro-orm/postgresql';
import type { LibraryItem, LibraryItemRequest, LibraryKind } from '../../shared/api';
import { queryRow, queryRows, run } from '../db/sql';
import { ApiError } from '../errors';
import type { Access } from './access';
import type { ActivityService } from './activity';

interface Row {
  id: number;
  workspace_id: number | null;
  kind: LibraryKind;
  name: string;
  values: Record<string, unknown>;
  source: string;
}

export type LibrarySort = 'name' | 'kind';

function toItem(r: Row): LibraryItem {
  return { id: r.id, kind: r.kind, name: r.name, values: r.values, source: r.source, builtIn: r.workspace_id === null };
}

/** Buffers and wall materials: built-in entries for everyone, read-only, plus each workspace's own. */
export class LibraryService {
  constructor(
    private readonly orm: MikroORM,
    private readonly activity: ActivityService,
  ) {}

  async list(workspaceId: number, q: { kind?: LibraryKind; sort: LibrarySort; order: 'asc' | 'desc'; limit: number; offset: number }): Promise<{ items: LibraryItem[]; total: number }> {
    const em = this.orm.em.fork();
    const where = `(workspace_id is null or workspace_id = ?)${q.kind ? ' and kind = ?' : ''}`;
    const params: unknown[] = q.kind ? [workspaceId, q.kind] : [workspaceId];
    const dir = q.order === 'desc' ? 'desc' : 'asc';
    const order = q.sort === 'kind' ? `kind ${dir}, workspace_id nulls first, lower(name)` : `lower(name) ${dir}`;
    const [rows, count] = await Promise.all([
      queryRows<Row>(em, `select id, workspace_id, kind, name, values, source from library_items where ${where} order by ${order}, id limit ? offset ?`, [...params, q.limit, q.offset]),
      queryRow<{ n: string }>(em, `select count(*) as n from library_items where ${where}`, params),
    ]);
    return { items: rows.map(toItem), total: Number(count?.n ?? 0) };
  }

  async create(access: Access, body: LibraryItemRequest): Promise<LibraryItem> {
    return this.orm.em.fork().transactional(async (em) => {
      const row = await queryRow<Row>(
        em,
        `insert into library_items (workspace_id, kind, name, values, source, created_at, updated_at, created_by_id)
         values (?, ?, ?, ?::jsonb, ?, now(), now(), ?) returning id, workspace_id, kind, name, values, source`,
        [access.workspaceId, body.kind, body.name.trim(), JSON.stringify(body.values), body.source ?? '', access.userId],
      );
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'library.added', message: `added the ${body.kind} "${body.name.trim()}" to the library` });
      return toItem(row!);
    });
  }

  async update(access: Access, itemId: number, body: LibraryItemRequest): Promise<LibraryItem> {
    return this.orm.em.fork().transactional(async (em) => {
      const row = await queryRow<Row>(
        em,
        `update library_items set kind = ?, name = ?, values = ?::jsonb, source = ?, updated_at = now()
         where id = ? and workspace_id = ? returning id, workspace_id, kind, name, values, source`,
        [body.kind, body.name.trim(), JSON.stringify(body.values), body.source ?? '', itemId, access.workspaceId],
      );
      if (!row) throw new ApiError('not-found', 'No such library entry');
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'library.changed', message: `changed the ${row.kind} "${row.name}" in the library` });
      return toItem(row);
    });
  }

  async remove(access: Access, itemId: number): Promise<void> {
    await this.orm.em.fork().transactional(async (em) => {
      const row = await queryRow<Row>(em, 'delete from library_items where id = ? and workspace_id = ? returning id, workspace_id, kind, name, values, source', [itemId, access.workspaceId]);
      if (!row) throw new ApiError('not-found', 'No such library entry');
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'library.removed', message: `removed the ${row.kind} "${row.name}" from the library` });
    });
  }
}
