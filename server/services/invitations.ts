import type { MikroORM } from '@mikro-orm/postgresql';
import type { AcceptInvitationRequest, Invitation, InvitationPreview, Role } from '../../shared/api';
import type { SignedInUser } from '../auth/passport';
import { newToken, tokenHash } from '../auth/secrets';
import type { ServerConfig } from '../config';
import { iso, queryRow, queryRows, run } from '../db/sql';
import { ApiError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from '../mail/messages';
import type { Access } from './access';
import type { ActivityService } from './activity';
import { normaliseEmail, passwordProblem, type AuthService, type Grant } from './auth';
import type { WorkspaceService } from './workspaces';

const VALID_DAYS = 7;

interface Row {
  id: number;
  email: string;
  role: Role;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  invited_by_id: number | null;
  inviter: string | null;
}

interface Pending {
  id: number;
  workspace_id: number;
  workspace_name: string;
  email: string;
  role: Role;
}

function toInvitation(r: Row): Invitation {
  return {
    id: r.id,
    email: r.email,
    role: r.role,
    createdAt: iso(r.created_at),
    expiresAt: iso(r.expires_at),
    acceptedAt: r.accepted_at ? iso(r.accepted_at) : null,
    invitedBy: r.invited_by_id === null ? undefined : { id: r.invited_by_id, name: r.inviter ?? '' },
  };
}

const SELECT = `select i.id, i.email, i.role, i.created_at, i.expires_at, i.accepted_at, i.invited_by_id, u.name as inviter
  from invitations i left join users u on u.id = i.invited_by_id`;

/** Invitations by e-mail: the link's token is mailed and only its hash kept; accepting makes the account if needed. */
export class InvitationService {
  constructor(
    private readonly orm: MikroORM,
    private readonly config: ServerConfig,
    private readonly mailer: Mailer,
    private readonly auth: AuthService,
    private readonly workspaces: WorkspaceService,
    private readonly activity: ActivityService,
  ) {}

  async list(workspaceId: number, q: { limit: number; offset: number; order: 'asc' | 'desc' }): Promise<{ items: Invitation[]; total: number }> {
    const em = this.orm.em.fork();
    const dir = q.order === 'asc' ? 'asc' : 'desc';
    const [rows, count] = await Promise.all([
      queryRows<Row>(em, `${SELECT} where i.workspace_id = ? order by i.created_at ${dir}, i.id ${dir} limit ? offset ?`, [workspaceId, q.limit, q.offset]),
      queryRow<{ n: string }>(em, 'select count(*) as n from invitations where workspace_id = ?', [workspaceId]),
    ]);
    return { items: rows.map(toInvitation), total: Number(count?.n ?? 0) };
  }

  /** Invites an e-mail (replacing an earlier pending invitation of it) and mails the link. */
  async invite(access: Access, inviter: SignedInUser, rawEmail: string, role: Role): Promise<Invitation> {
    const email = normaliseEmail(rawEmail);
    const token = newToken();
    const { invitation, workspace } = await this.orm.em.fork().transactional(async (em) => {
      const member = await queryRow<{ one: number }>(
        em,
        'select 1 as one from memberships m join users u on u.id = m.user_id where m.workspace_id = ? and u.email = ?',
        [access.workspaceId, email],
      );
      if (member) throw new ApiError('conflict', 'This person is a member of the workspace already', 'email');
      await run(em, 'delete from invitations where workspace_id = ? and email = ? and accepted_at is null', [access.workspaceId, email]);
      const created = await queryRow<{ id: number }>(
        em,
        `insert into invitations (workspace_id, email, role, token_hash, invited_by_id, created_at, expires_at)
         values (?, ?, ?, ?, ?, now(), now() + make_interval(days => ?)) returning id`,
        [access.workspaceId, email, role, tokenHash(token), inviter.id, VALID_DAYS],
      );
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: inviter.id, kind: 'member.invited', message: `invited ${email} as ${role}` });
      const ws = await queryRow<{ name: string }>(em, 'select name from workspaces where id = ?', [access.workspaceId]);
      const row = await queryRow<Row>(em, `${SELECT} where i.id = ?`, [created!.id]);
      return { invitation: toInvitation(row!), workspace: ws!.name };
    });
    const url = `${this.config.publicBaseUrl}/invite?token=${encodeURIComponent(token)}`;
    await this.mailer
      .send(invitationMail({ to: email, inviter: inviter.name, workspace, role, url, expiresAt: new Date(invitation.expiresAt) }))
      .catch((err: unknown) => console.error(`[mail] invitation to ${email} not sent: ${err instanceof Error ? err.message : String(err)}`));
    return invitation;
  }

  async revoke(access: Access, invitationId: number): Promise<void> {
    await this.orm.em.fork().transactional(async (em) => {
      const gone = await queryRow<{ email: string }>(
        em,
        'delete from invitations where id = ? and workspace_id = ? and accepted_at is null returning email',
        [invitationId, access.workspaceId],
      );
      if (!gone) throw new ApiError('not-found', 'No such pending invitation');
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, kind: 'member.uninvited', message: `withdrew the invitation of ${gone.email}` });
    });
  }

  private async pending(token: string): Promise<Pending> {
    const row = await queryRow<Pending>(
      this.orm.em.fork(),
      `select i.id, i.workspace_id, w.name as workspace_name, i.email, i.role from invitations i
       join workspaces w on w.id = i.workspace_id
       where i.token_hash = ? and i.accepted_at is null and i.expires_at > now()`,
      [tokenHash(token)],
    );
    if (!row) throw new ApiError('not-found', 'This invitation link is not valid any more (used, withdrawn or expired)');
    return row;
  }

  async preview(token: string): Promise<InvitationPreview> {
    const inv = await this.pending(token);
    const account = await this.auth.findUserByEmail(this.orm.em.fork(), inv.email);
    return { workspaceName: inv.workspace_name, email: inv.email, role: inv.role, accountExists: Boolean(account) };
  }

  /**
   * Accepts an invitation and signs the invitee in. An existing account proves itself with its password or a
   * signed-in token of that very account; otherwise name and password make the account.
   */
  async accept(token: string, body: AcceptInvitationRequest, signedIn: SignedInUser | undefined): Promise<Grant> {
    const inv = await this.pending(token);
    const account = await this.auth.findUserByEmail(this.orm.em.fork(), inv.email);
    let passwordHash: string | null = null;
    if (account) {
      if (signedIn && signedIn.id !== account.id) {
        throw new ApiError('forbidden', `This invitation is for ${inv.email}; sign in with that account to accept it`);
      }
      if (!signedIn) {
        if (!body.password) throw new ApiError('invalid', 'Enter the password of your account to accept', 'password');
        if (!(await this.auth.checkPassword(account, body.password))) {
          throw new ApiError('invalid', 'This is not the password of the account', 'password');
        }
      }
    } else {
      if (!body.name?.trim()) throw new ApiError('invalid', 'Enter your name to make the account', 'name');
      if (!body.password) throw new ApiError('invalid', 'Choose a password to make the account', 'password');
      const problem = passwordProblem(body.password);
      if (problem) throw new ApiError('invalid', `password ${problem}`, 'password');
      passwordHash = await this.auth.hash(body.password);
    }
    return this.orm.em.fork().transactional(async (em) => {
      const user = account ?? (await this.auth.insertUser(em, inv.email, body.name!, passwordHash!));
      const taken = await run(
        em,
        'update invitations set accepted_at = now(), accepted_by_id = ? where id = ? and accepted_at is null and expires_at > now()',
        [user.id, inv.id],
      );
      if (!taken) throw new ApiError('not-found', 'This invitation link is not valid any more (used, withdrawn or expired)');
      const added = await this.workspaces.addMember(em, inv.workspace_id, user.id, inv.role);
      if (added) {
        await this.activity.record(em, { workspaceId: inv.workspace_id, actorId: user.id, kind: 'member.joined', message: `joined as ${inv.role}` });
      }
      return this.auth.openSession(em, { id: user.id, email: user.email, name: user.name });
    });
  }
}
