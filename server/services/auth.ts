import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, type User } from '../../shared/api';
import type { SignedInUser } from '../auth/passport';
import { SessionCache, type OpenSession } from '../auth/session-cache';
import { hashPassword, newToken, passwordMatches, sameHash, tokenHash } from '../auth/secrets';
import { signAccessToken } from '../auth/tokens';
import type { ServerConfig } from '../config';
import { preparedRow, queryRow, run } from '../db/sql';
import { ApiError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { resetMail } from '../mail/messages';

/** What signing in (or refreshing) gives: an access token and, when a new refresh secret was made, the cookie's parts. */
export interface Grant {
  token: string;
  user: User;
  expiresIn: number;
  refresh?: { sessionId: string; secret: string };
}

interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
}

const RESET_MINUTES = 60;
/** A refresh token replaced this recently still works once more (two tabs refreshing at the same moment). */
const ROTATION_GRACE_SECONDS = 30;

/** What is wrong with a password being chosen, or null. */
export function passwordProblem(password: string): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `must have at least ${PASSWORD_MIN_LENGTH} characters`;
  if (Buffer.byteLength(password) > PASSWORD_MAX_BYTES) return `must be at most ${PASSWORD_MAX_BYTES} bytes`;
  return null;
}

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** Accounts, sessions, passwords. Sessions are rows; ending one makes its access tokens stop working at once. */
export class AuthService {
  /** Open sessions seen in the last few seconds (config.sessionCacheSeconds); see SessionCache for what that means. */
  private readonly sessions: SessionCache;

  constructor(
    private readonly orm: MikroORM,
    private readonly config: ServerConfig,
    private readonly mailer: Mailer,
  ) {
    this.sessions = new SessionCache(config.sessionCacheSeconds * 1000, (sessionId, userId) => this.lookUpSession(sessionId, userId));
  }

  /** For passport-jwt: the user of a session that is still open. */
  findSession(sessionId: string, userId: number): Promise<SignedInUser | null> {
    return this.sessions.find(sessionId, userId);
  }

  private async lookUpSession(sessionId: string, userId: number): Promise<OpenSession | null> {
    const row = await preparedRow<{ id: number; email: string; name: string; expires_at: Date }>(
      this.orm,
      `select u.id, u.email, u.name, s.expires_at from sessions s join users u on u.id = s.user_id
       where s.id = $1 and s.user_id = $2 and s.expires_at > now()`,
      [sessionId, userId],
    );
    if (!row) return null;
    return { user: { id: row.id, email: row.email, name: row.name, sessionId }, expiresAt: new Date(row.expires_at).getTime() };
  }

  async me(userId: number): Promise<User> {
    const row = await queryRow<User>(this.orm.em.fork(), 'select id, email, name from users where id = ?', [userId]);
    if (!row) throw new ApiError('not-signed-in', 'The account no longer exists');
    return row;
  }

  hash(password: string): Promise<string> {
    return hashPassword(password, this.config.passwordHashCost);
  }

  async findUserByEmail(em: EntityManager, email: string): Promise<UserRow | undefined> {
    return queryRow<UserRow>(em, 'select id, email, name, password_hash from users where email = ?', [normaliseEmail(email)]);
  }

  async checkPassword(user: UserRow | undefined, password: string): Promise<boolean> {
    return passwordMatches(password, user?.password_hash ?? null, this.config.passwordHashCost);
  }

  /** Inserts an account; 409 when the e-mail is taken. Call inside a transaction. */
  async insertUser(em: EntityManager, email: string, name: string, passwordHash: string): Promise<User> {
    const row = await queryRow<User>(
      em,
      `insert into users (email, name, password_hash, created_at) values (?, ?, ?, now())
       on conflict (email) do nothing returning id, email, name`,
      [normaliseEmail(email), name.trim(), passwordHash],
    );
    if (!row) throw new ApiError('conflict', 'An account with this e-mail exists already; sign in instead', 'email');
    return row;
  }

  /** Opens a session for a user (inside the caller's transaction when given one). */
  async openSession(em: EntityManager, user: User): Promise<Grant> {
    const secret = newToken();
    const row = await queryRow<{ id: string }>(
      em,
      `insert into sessions (id, user_id, refresh_hash, rotated_at, created_at, expires_at)
       values (gen_random_uuid(), ?, ?, now(), now(), now() + make_interval(days => ?)) returning id`,
      [user.id, tokenHash(secret), this.config.refreshTokenDays],
    );
    const sessionId = row!.id;
    return { ...this.accessFor(user, sessionId), refresh: { sessionId, secret } };
  }

  private accessFor(user: User, sessionId: string): Grant {
    return {
      token: signAccessToken(this.config, user.id, sessionId),
      user: { id: user.id, email: user.email, name: user.name },
      expiresIn: this.config.accessTokenSeconds,
    };
  }

  async signIn(email: string, password: string): Promise<Grant> {
    const em = this.orm.em.fork();
    const user = await this.findUserByEmail(em, email);
    if (!(await this.checkPassword(user, password)) || !user) {
      throw new ApiError('not-signed-in', 'The e-mail or the password is wrong');
    }
    await run(em, 'delete from sessions where user_id = ? and expires_at <= now()', [user.id]);
    return this.openSession(em, user);
  }

  async signUp(email: string, name: string, password: string): Promise<Grant> {
    if (!this.config.allowSignUp) throw new ApiError('forbidden', 'Accounts are made by invitation only on this server');
    const passwordHash = await this.hash(password);
    return this.orm.em.fork().transactional(async (em) => {
      const user = await this.insertUser(em, email, name, passwordHash);
      return this.openSession(em, user);
    });
  }

  /**
   * Trades a refresh cookie for a new access token and rotates the cookie. A cookie replaced moments ago by a
   * concurrent refresh still gets an access token (without a new cookie); an older one ends the session, since
   * it can only come from a copy.
   */
  async refresh(sessionId: string, secret: string): Promise<Grant> {
    const em = this.orm.em.fork();
    const presented = tokenHash(secret);
    const next = newToken();
    const rotated = await queryRow<{ user_id: number }>(
      em,
      `update sessions set previous_hash = refresh_hash, refresh_hash = ?, rotated_at = now(),
         expires_at = now() + make_interval(days => ?)
       where id = ? and refresh_hash = ? and expires_at > now() returning user_id`,
      [tokenHash(next), this.config.refreshTokenDays, sessionId, presented],
    );
    if (rotated) {
      const user = await this.me(rotated.user_id);
      return { ...this.accessFor(user, sessionId), refresh: { sessionId, secret: next } };
    }
    const session = await queryRow<{ user_id: number; previous_hash: string | null; recent: boolean }>(
      em,
      `select user_id, previous_hash, rotated_at > now() - make_interval(secs => ?) as recent
       from sessions where id = ? and expires_at > now()`,
      [ROTATION_GRACE_SECONDS, sessionId],
    );
    if (session?.recent && session.previous_hash && sameHash(session.previous_hash, presented)) {
      return this.accessFor(await this.me(session.user_id), sessionId);
    }
    if (session) {
      await run(em, 'delete from sessions where id = ?', [sessionId]);
      this.sessions.forget(sessionId);
    }
    throw new ApiError('not-signed-in', 'The session has ended; sign in again');
  }

  async signOut(sessionId: string): Promise<void> {
    await run(this.orm.em.fork(), 'delete from sessions where id = ?', [sessionId]);
    this.sessions.forget(sessionId);
  }

  /** Changes the password and ends the account's other sessions. */
  async changePassword(user: SignedInUser, currentPassword: string, newPassword: string): Promise<void> {
    const em = this.orm.em.fork();
    const row = await this.findUserByEmail(em, user.email);
    if (!row || !(await this.checkPassword(row, currentPassword))) {
      throw new ApiError('invalid', 'The current password is wrong', 'currentPassword');
    }
    const passwordHash = await this.hash(newPassword);
    await em.transactional(async (tx) => {
      await run(tx, 'update users set password_hash = ? where id = ?', [passwordHash, user.id]);
      await run(tx, 'delete from sessions where user_id = ? and id <> ?', [user.id, user.sessionId]);
    });
    this.sessions.forgetUser(user.id);
  }

  /** Mails a reset link when the account exists; answers the same either way (no account enumeration). */
  async requestReset(email: string): Promise<void> {
    const em = this.orm.em.fork();
    const user = await this.findUserByEmail(em, email);
    if (!user) return;
    const token = newToken();
    const row = await queryRow<{ expires_at: Date | string }>(
      em,
      `insert into password_resets (user_id, token_hash, created_at, expires_at)
       values (?, ?, now(), now() + make_interval(mins => ?)) returning expires_at`,
      [user.id, tokenHash(token), RESET_MINUTES],
    );
    const expiresAt = new Date(row!.expires_at);
    const url = `${this.config.publicBaseUrl}/reset?token=${encodeURIComponent(token)}`;
    this.mailer.sendLater(resetMail({ to: user.email, name: user.name, url, expiresAt }));
  }

  /** Uses a reset link once: sets the password and ends every session of the account. */
  async resetPassword(token: string, newPassword: string): Promise<void> {
    const passwordHash = await this.hash(newPassword);
    const userId = await this.orm.em.fork().transactional(async (em) => {
      const used = await queryRow<{ user_id: number }>(
        em,
        `update password_resets set used_at = now()
         where token_hash = ? and used_at is null and expires_at > now() returning user_id`,
        [tokenHash(token)],
      );
      if (!used) throw new ApiError('invalid', 'This reset link has expired or was used already; ask for a new one', 'token');
      await run(em, 'update users set password_hash = ? where id = ?', [passwordHash, used.user_id]);
      await run(em, 'delete from sessions where user_id = ?', [used.user_id]);
      await run(em, 'update password_resets set used_at = now() where user_id = ? and used_at is null', [used.user_id]);
      return used.user_id;
    });
    this.sessions.forgetUser(userId);
  }
}
