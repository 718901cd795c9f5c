import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import type { Member, Role, Workspace } from '../../shared/api';
import { queryRow, queryRows, run } from '../db/sql';
import { ApiError } from '../errors';
import type { Access } from './access';
import type { ActivityService } from './activity';

export type MemberSort = 'name' | 'email' | 'role';

const MEMBER_ORDER: Record<MemberSort, string> = {
  name: 'u.name',
  email: 'u.email',
  role: "array_position(array['owner','editor','reviewer','viewer'], m.role)",
};

/** Workspaces and their members; owners manage members, and a workspace always keeps at least one owner. */
export class WorkspaceService {
  constructor(
    private readonly orm: MikroORM,
    private readonly activity: ActivityService,
  ) {}

  async listFor(userId: number): Promise<Workspace[]> {
    return queryRows<Workspace>(
      this.orm.em.fork(),
      `select w.id, w.name, m.role from memberships m join workspaces w on w.id = m.workspace_id
       where m.user_id = ? order by lower(w.name), w.id`,
      [userId],
    );
  }

  async create(userId: number, name: string): Promise<Workspace> {
    return this.orm.em.fork().transactional(async (em) => {
      const ws = await queryRow<{ id: number; name: string }>(
        em,
        'insert into workspaces (name, created_at, created_by_id) values (?, now(), ?) returning id, name',
        [name.trim(), userId],
      );
      await this.addMember(em, ws!.id, userId, 'owner');
      await this.activity.record(em, { workspaceId: ws!.id, actorId: userId, kind: 'workspace.created', message: `created the workspace "${ws!.name}"` });
      return { id: ws!.id, name: ws!.name, role: 'owner' as const };
    });
  }

  /** Adds a membership unless one exists (an existing role is kept); answers whether a row was added. */
  async addMember(em: EntityManager, workspaceId: number, userId: number, role: Role): Promise<boolean> {
    const added = await run(
      em,
      `insert into memberships (workspace_id, user_id, role, created_at) values (?, ?, ?, now())
       on conflict (workspace_id, user_id) do nothing`,
      [workspaceId, userId, role],
    );
    return added > 0;
  }

  async get(access: Access): Promise<Workspace> {
    const row = await queryRow<{ name: string }>(this.orm.em.fork(), 'select name from workspaces where id = ?', [access.workspaceId]);
    return { id: access.workspaceId, name: row!.name, role: access.role };
  }

  async members(workspaceId: number, q: { sort: MemberSort; order: 'asc' | 'desc'; limit: number; offset: number }): Promise<{ items: Member[]; total: number }> {
    const em = this.orm.em.fork();
    const dir = q.order === 'desc' ? 'desc' : 'asc';
    const [items, count] = await Promise.all([
      queryRows<Member>(
        em,
        `select u.id as "userId", u.email, u.name, m.role from memberships m join users u on u.id = m.user_id
         where m.workspace_id = ? order by ${MEMBER_ORDER[q.sort]} ${dir}, u.id limit ? offset ?`,
        [workspaceId, q.limit, q.offset],
      ),
      queryRow<{ n: string }>(em, 'select count(*) as n from memberships where workspace_id = ?', [workspaceId]),
    ]);
    return { items, total: Number(count?.n ?? 0) };
  }

  /**
   * Locks the workspace's memberships so that two owners demoting each other cannot leave it without one, and
   * checks again under the lock that the actor is still an owner (the role check before it ran without a lock).
   */
  private async lockMembers(em: EntityManager, access: Access, userId: number) {
    const rows = await queryRows<{ user_id: number; role: Role; name: string }>(
      em,
      `select m.user_id, m.role, u.name from memberships m join users u on u.id = m.user_id
       where m.workspace_id = ? order by m.id for update of m`,
      [access.workspaceId],
    );
    const actor = rows.find((r) => r.user_id === access.userId);
    if (!actor) throw new ApiError('not-found', 'No such workspace');
    if (userId !== access.userId && actor.role !== 'owner') {
      throw new ApiError('forbidden', `This needs the owner role in the workspace; yours is now ${actor.role}`);
    }
    const target = rows.find((r) => r.user_id === userId);
    if (!target) throw new ApiError('not-found', 'No such member in this workspace');
    const owners = rows.filter((r) => r.role === 'owner').length;
    return { target, lastOwner: target.role === 'owner' && owners === 1 };
  }

  async changeRole(access: Access, userId: number, role: Role): Promise<Member> {
    return this.orm.em.fork().transactional(async (em) => {
      const { target, lastOwner } = await this.lockMembers(em, access, userId);
      if (lastOwner && role !== 'owner') {
        throw new ApiError('conflict', 'This is the last owner of the workspace; make someone else owner first');
      }
      await run(em, 'update memberships set role = ? where workspace_id = ? and user_id = ?', [role, access.workspaceId, userId]);
      if (target.role !== role) {
        await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'member.role', message: `made ${target.name} ${role}` });
      }
      const member = await queryRow<Member>(
        em,
        'select u.id as "userId", u.email, u.name, m.role from memberships m join users u on u.id = m.user_id where m.workspace_id = ? and m.user_id = ?',
        [access.workspaceId, userId],
      );
      return member!;
    });
  }

  async removeMember(access: Access, userId: number): Promise<void> {
    await this.orm.em.fork().transactional(async (em) => {
      const { target, lastOwner } = await this.lockMembers(em, access, userId);
      if (lastOwner) throw new ApiError('conflict', 'This is the last owner of the workspace; make someone else owner first');
      await run(em, 'delete from memberships where workspace_id = ? and user_id = ?', [access.workspaceId, userId]);
      const message = userId === access.userId ? 'left the workspace' : `removed ${target.name} from the workspace`;
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'member.removed', message });
    });
  }
}
