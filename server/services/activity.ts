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

  /**
   * Like record, but a repeat of the design's latest line (same kind, same person, within `minutes`) updates that
   * line instead: the app may save after every edit, and the log should not fill with them.
   */
  async recordCoalesced(em: EntityManager, entry: ActivityEntry & { designId: number }, minutes = 10): Promise<void> {
    const updated = await run(
      em,
      `update activity_events set message = ?, created_at = now()
       where id = (select id from activity_events where design_id = ? order by created_at desc, id desc limit 1)
         and kind = ? and actor_id = ? and created_at > now() - make_interval(mins => ?)`,
      [entry.message, entry.designId, entry.kind, entry.actorId, minutes],
    );
    if (!updated) await this.record(em, entry);
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
