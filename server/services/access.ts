import type { MikroORM } from '@mikro-orm/postgresql';
import { ROLE_RANK, type Role } from '../../shared/api';
import { preparedRow } from '../db/sql';
import { ApiError } from '../errors';

/** What a role check found: the workspace of the thing asked for and the caller's role in it. */
export interface Access {
  userId: number;
  workspaceId: number;
  role: Role;
}

/** What a lookup reads: the thing's workspace and the caller's membership role there (null when not a member). */
export interface Found {
  workspace_id: number;
  role: Role | null;
}

/** The thing's workspace and the caller's role there, by the caller ($1) and the thing's id ($2). */
const LOOKUPS = {
  workspace: `select w.id as workspace_id, m.role from workspaces w
    left join memberships m on m.workspace_id = w.id and m.user_id = $1 where w.id = $2`,
  design: `select d.workspace_id, m.role from designs d
    left join memberships m on m.workspace_id = d.workspace_id and m.user_id = $1 where d.id = $2`,
  revision: `select d.workspace_id, m.role from revisions r join designs d on d.id = r.design_id
    left join memberships m on m.workspace_id = d.workspace_id and m.user_id = $1 where r.id = $2`,
  run: `select d.workspace_id, m.role from runs x join revisions r on r.id = x.revision_id join designs d on d.id = r.design_id
    left join memberships m on m.workspace_id = d.workspace_id and m.user_id = $1 where x.id = $2`,
  sweep: `select d.workspace_id, m.role from sweeps s join revisions r on r.id = s.revision_id join designs d on d.id = r.design_id
    left join memberships m on m.workspace_id = d.workspace_id and m.user_id = $1 where s.id = $2`,
  library: `select l.workspace_id, m.role from library_items l
    left join memberships m on m.workspace_id = l.workspace_id and m.user_id = $1 where l.id = $2`,
} as const;

export type Resource = keyof typeof LOOKUPS;

const NAMES: Record<Resource, string> = {
  workspace: 'workspace',
  design: 'design',
  revision: 'revision',
  run: 'run',
  sweep: 'sweep',
  library: 'library entry',
};

export function atLeast(role: Role, min: Role): boolean {
  return ROLE_RANK[role] >= ROLE_RANK[min];
}

/**
 * Role checks for every route that touches a workspace's things. A thing that does not exist and a thing in a
 * workspace the caller is not in answer the same 404; a member whose role is too low gets 403.
 */
export class AccessService {
  constructor(private readonly orm: MikroORM) {}

  async check(resource: Resource, userId: number, id: number, min: Role): Promise<Access> {
    return this.decide(resource, userId, await preparedRow<Found>(this.orm, LOOKUPS[resource], [userId, id]), min);
  }

  /**
   * The decision of `check` on a row that a service read itself, in one round trip with the thing: it carries the
   * thing's `workspace_id` and `role` from `left join memberships m on m.workspace_id = <workspace> and m.user_id
   * = <caller>`, as in LOOKUPS; undefined when no such thing exists.
   */
  decide(resource: Resource, userId: number, found: Found | undefined, min: Role): Access {
    if (resource === 'library' && found && found.workspace_id === null) {
      throw new ApiError('forbidden', 'Built-in library entries are read-only; add your own entry instead');
    }
    if (!found || !found.role) throw new ApiError('not-found', `No such ${NAMES[resource]}`);
    if (!atLeast(found.role, min)) {
      throw new ApiError('forbidden', `This needs the ${min} role or higher in the workspace; yours is ${found.role}`);
    }
    return { userId, workspaceId: found.workspace_id, role: found.role };
  }

  workspace(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('workspace', userId, id, min);
  }

  design(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('design', userId, id, min);
  }

  revision(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('revision', userId, id, min);
  }

  run(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('run', userId, id, min);
  }

  sweep(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('sweep', userId, id, min);
  }

  /** Library entries of a workspace; built-in ones (no workspace) answer 403 here, so use this for writes only. */
  libraryItem(userId: number, id: number, min: Role): Promise<Access> {
    return this.check('library', userId, id, min);
  }
}
