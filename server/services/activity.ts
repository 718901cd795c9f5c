import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import type { ActivityItem, Page } from '../../shared/api';
import { iso, queryRow, queryRows, run } from '../db/sql';

export interface ActivityEntry {
  workspaceId: number;
  actorId: number | null;
  designId?: number | null;
  kind: string;
  message: string;
}

interface Row {
  id: number;
  kind: string;
  message: string;
  created_at: Date;
  design_id: number | null;
  actor_id: number | null;
  actor_name: string | null;
}

/** The workspace's activity log: written inside the transaction of the change it describes. */
export class ActivityService {
  constructor(private readonly orm: MikroORM) {}

  async record(em: EntityManager, entry: ActivityEntry): Promise<void> {
    await run(
      em,
      'insert into activity_events (workspace_id, actor_id, design_id, kind, message, created_at) values (?, ?, ?, ?, ?, now())',
      [entry.workspaceId, entry.actorId, entry.designId ?? null, entry.kind, entry.message],
    );
  }

  async list(workspaceId: number, q: { designId?: number; limit: number; offset: number; order: 'asc' | 'desc' }): Promise<Page<ActivityItem>> {
    const em = this.orm.em.fork();
    const where = q.designId === undefined ? 'a.workspace_id = ?' : 'a.workspace_id = ? and a.design_id = ?';
    const params = q.designId === undefined ? [workspaceId] : [workspaceId, q.designId];
    const dir = q.order === 'asc' ? 'asc' : 'desc';
    const [rows, count] = await Promise.all([
      queryRows<Row>(
        em,
        `select a.id, a.kind, a.message, a.created_at, a.design_id, a.actor_id, u.name as actor_name
         from activity_events a left join users u on u.id = a.actor_id
         where ${where} order by a.created_at ${dir}, a.id ${dir} limit ? offset ?`,
        [...params, q.limit, q.offset],
      ),
      queryRow<{ n: string }>(em, `select count(*) as n from activity_events a where ${where}`, params),
    ]);
    return {
      items: rows.map((r) => ({
        id: r.id,
        kind: r.kind,
        message: r.message,
        createdAt: iso(r.created_at),
        actor: r.actor_id === null ? null : { id: r.actor_id, name: r.actor_name ?? '' },
        designId: r.design_id,
      })),
      total: Number(count?.n ?? 0),
    };
  }
}
