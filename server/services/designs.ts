import type { MikroORM } from '@mikro-orm/postgresql';
import { parseDesign } from '../../shared/design';
import type { DesignDetail, DesignSort, DesignSummary, Page, ReviewState, Role } from '../../shared/api';
import type { SignedInUser } from '../auth/passport';
import type { ServerConfig } from '../config';
import { containsPattern, iso, preparedRow, preparedRows, queryRow, queryRows } from '../db/sql';
import { ApiError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { reviewMail } from '../mail/messages';
import { atLeast, type Access, type AccessService, type Found } from './access';
import type { ActivityService } from './activity';

interface SummaryRow {
  id: number;
  name: string;
  version: number;
  review_state: ReviewState;
  updated_at: Date;
  updated_by_id: number | null;
  updated_by_name: string | null;
}

interface Row extends SummaryRow {
  workspace_id: number;
  document: unknown;
  created_at: Date;
  /** The reader's membership role in the design's workspace (null when not a member). */
  role: Role | null;
}

const SUMMARY_COLUMNS = `d.id, d.name, d.version, d.review_state, d.updated_at, d.updated_by_id, u.name as updated_by_name`;

/** One design ($2) with the role of a user ($1) in its workspace (for AccessService.decide). */
const DETAIL = `select ${SUMMARY_COLUMNS}, d.workspace_id, d.created_at, d.document, m.role from designs d
  left join users u on u.id = d.updated_by_id
  left join memberships m on m.workspace_id = d.workspace_id and m.user_id = $1 where d.id = $2`;

const ORDER: Record<DesignSort, string> = {
  name: 'lower(d.name)',
  updatedAt: 'd.updated_at',
  reviewState: "array_position(array['draft','in review','mask-ready'], d.review_state)",
};

function summary(r: SummaryRow): DesignSummary {
  return {
    id: r.id,
    name: r.name,
    version: r.version,
    reviewState: r.review_state,
    updatedAt: iso(r.updated_at),
    updatedBy: r.updated_by_id === null ? null : { id: r.updated_by_id, name: r.updated_by_name ?? '' },
  };
}

function detail(r: Row, role: Role): DesignDetail {
  return { ...summary(r), document: r.document, workspaceId: r.workspace_id, role, createdAt: iso(r.created_at) };
}

/** Refuses a document that is not a valid design (shared/design.ts), naming the first bad field as `document.<path>`. */
export function checkDocument(document: unknown): void {
  if (document === null || typeof document !== 'object' || Array.isArray(document)) {
    throw new ApiError('invalid', 'document must be a design object (osmolane.design/1)', 'document');
  }
  const result = parseDesign(document);
  if (!result.ok) {
    const first = result.errors[0] ?? { field: '', message: 'is not a valid design' };
    const field = first.field ? `document.${first.field}` : 'document';
    throw new ApiError('invalid', `${field} ${first.message}`, field);
  }
}

/** Who may move a design from one review state to another. */
function reviewRule(from: ReviewState, to: ReviewState, role: Role): 'ok' | 'role' | 'state' {
  if (to === 'mask-ready') {
    if (role !== 'reviewer' && role !== 'owner') return 'role';
    return from === 'in review' ? 'ok' : 'state';
  }
  return atLeast(role, 'reviewer') ? 'ok' : 'role';
}

/** Designs: the current document with optimistic locking, review states, and the mail to reviewers. */
export class DesignService {
  constructor(
    private readonly orm: MikroORM,
    private readonly config: ServerConfig,
    private readonly mailer: Mailer,
    private readonly activity: ActivityService,
    private readonly access: AccessService,
  ) {}

  /**
   * A page of a workspace's designs for one of its members (viewer or higher; otherwise 404 as AccessService says).
   * One round trip: the caller's membership, the page and the total alongside; only a page past the end (no rows
   * at all) asks again, for the role and the count.
   */
  async list(
    userId: number,
    workspaceId: number,
    q: { sort: DesignSort; order: 'asc' | 'desc'; limit: number; offset: number; q?: string },
  ): Promise<Page<DesignSummary>> {
    const dir = q.order === 'asc' ? 'asc' : 'desc';
    const params: (string | number)[] = [userId, workspaceId, q.limit, q.offset];
    if (q.q) params.push(containsPattern(q.q));
    const filter = q.q ? ' and d.name ilike $5' : '';
    // Without designs (or without a matching one) the member's row still comes back, with d.* null.
    const rows = await preparedRows<Found & Partial<SummaryRow> & { total: string }>(
      this.orm,
      `select a.workspace_id, a.role, ${SUMMARY_COLUMNS}, count(d.id) over () as total
       from (select w.id as workspace_id, m.role from workspaces w
             left join memberships m on m.workspace_id = w.id and m.user_id = $1 where w.id = $2) a
       left join designs d on d.workspace_id = a.workspace_id and a.role is not null${filter}
       left join users u on u.id = d.updated_by_id
       order by ${ORDER[q.sort]} ${dir}, d.id ${dir} limit $3 offset $4`,
      params,
    );
    if (!rows.length) {
      await this.access.workspace(userId, workspaceId, 'viewer');
      const n = await queryRow<{ n: string }>(
        this.orm.em.fork(),
        `select count(*) as n from designs d where d.workspace_id = ?${q.q ? ' and d.name ilike ?' : ''}`,
        q.q ? [workspaceId, containsPattern(q.q)] : [workspaceId],
      );
      return { items: [], total: Number(n?.n ?? 0) };
    }
    this.access.decide('workspace', userId, rows[0], 'viewer');
    const items = rows.filter((r): r is typeof r & SummaryRow => r.id != null).map(summary);
    return { items, total: Number(rows[0]!.total) };
  }

  /** One design for a member of its workspace (viewer or higher): the role check and the read in one round trip. */
  async read(userId: number, designId: number): Promise<DesignDetail> {
    const row = await preparedRow<Row>(this.orm, DETAIL, [userId, designId]);
    const access = this.access.decide('design', userId, row, 'viewer');
    return detail(row!, access.role);
  }

  /** The design as it is now, for a caller whose access was checked already. */
  async get(access: Access, designId: number): Promise<DesignDetail> {
    const row = await preparedRow<Row>(this.orm, DETAIL, [access.userId, designId]);
    if (!row) throw new ApiError('not-found', 'No such design');
    return detail(row, access.role);
  }

  async create(access: Access, name: string, document: unknown): Promise<DesignDetail> {
    checkDocument(document);
    const id = await this.orm.em.fork().transactional(async (em) => {
      const row = await queryRow<{ id: number }>(
        em,
        `insert into designs (workspace_id, name, document, version, review_state, created_at, created_by_id, updated_at, updated_by_id)
         values (?, ?, ?::json, 1, 'draft', now(), ?, now(), ?) returning id`,
        [access.workspaceId, name.trim(), JSON.stringify(document), access.userId, access.userId],
      );
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId: row!.id, kind: 'design.created', message: `created the design "${name.trim()}"` });
      return row!.id;
    });
    return this.get(access, id);
  }

  /**
   * Saves a new document when `version` is the current one. The conditional UPDATE runs in a transaction: of two
   * saves from the same version, PostgreSQL lets one update the row and re-checks the other's WHERE against the
   * committed row, where the version no longer matches, so it touches nothing and answers 409.
   * A change to a mask-ready design sends it back to draft: the approval was for the layout before.
   */
  async save(access: Access, designId: number, body: { document: unknown; version: number; name?: string }): Promise<DesignDetail> {
    checkDocument(body.document);
    await this.orm.em.fork().transactional(async (em) => {
      const saved = await queryRow<{ version: number; was: ReviewState; name: string }>(
        em,
        `update designs d set document = ?::json, name = coalesce(?, d.name), version = d.version + 1,
           updated_at = now(), updated_by_id = ?,
           review_state = case when d.review_state = 'mask-ready' then 'draft' else d.review_state end
         from (select review_state as was from designs where id = ?) old
         where d.id = ? and d.version = ? returning d.version, old.was, d.name`,
        [JSON.stringify(body.document), body.name?.trim() ?? null, access.userId, designId, designId, body.version],
      );
      if (!saved) {
        const now = await queryRow<{ version: number }>(em, 'select version from designs where id = ?', [designId]);
        throw new ApiError(
          'conflict',
          `Someone saved this design first (it is at version ${now?.version ?? '?'}, your edit started from version ${body.version}); reload it and apply your change again`,
          'version',
        );
      }
      const entry = { workspaceId: access.workspaceId, actorId: access.userId, designId, kind: 'design.saved' };
      if (saved.was === 'mask-ready') {
        await this.activity.record(em, { ...entry, message: `saved "${saved.name}" as version ${saved.version}; back to draft, as the approved layout changed` });
      } else {
        await this.activity.recordCoalesced(em, { ...entry, message: `saved "${saved.name}" as version ${saved.version}` });
      }
    });
    return this.get(access, designId);
  }

  async review(access: Access, actor: SignedInUser, designId: number, to: ReviewState): Promise<DesignDetail> {
    const moved = await this.orm.em.fork().transactional(async (em) => {
      const current = await queryRow<{ review_state: ReviewState; name: string }>(
        em,
        'select review_state, name from designs where id = ? for update',
        [designId],
      );
      if (!current) throw new ApiError('not-found', 'No such design');
      const rule = reviewRule(current.review_state, to, access.role);
      if (rule === 'role') throw new ApiError('forbidden', `Your role (${access.role}) cannot set a design to ${to}`);
      if (rule === 'state') throw new ApiError('conflict', `A design goes to mask-ready from "in review" only; this one is ${current.review_state}`, 'state');
      if (current.review_state === to) return false;
      await queryRow(em, 'update designs set review_state = ? where id = ?', [to, designId]);
      await this.activity.record(em, { workspaceId: access.workspaceId, actorId: access.userId, designId, kind: 'review.changed', message: `set "${current.name}" to ${to}` });
      return true;
    });
    const design = await this.get(access, designId);
    if (moved && to === 'in review') await this.mailReviewers(access, actor, design);
    return design;
  }

  private async mailReviewers(access: Access, actor: SignedInUser, design: DesignDetail): Promise<void> {
    const em = this.orm.em.fork();
    const [reviewers, info] = await Promise.all([
      queryRows<{ email: string }>(
        em,
        `select u.email from memberships m join users u on u.id = m.user_id
         where m.workspace_id = ? and m.role in ('reviewer', 'owner') and u.id <> ? order by u.id`,
        [access.workspaceId, actor.id],
      ),
      queryRow<{ workspace: string; revision: number | null }>(
        em,
        'select w.name as workspace, (select max(number) from revisions where design_id = ?) as revision from workspaces w where w.id = ?',
        [design.id, access.workspaceId],
      ),
    ]);
    const url = `${this.config.publicBaseUrl}/designs/${design.id}`;
    await Promise.all(
      reviewers.map((r) =>
        this.mailer
          .send(reviewMail({ to: r.email, requester: actor.name, design: design.name, workspace: info!.workspace, version: design.version, revision: info!.revision, url }))
          .catch((err: unknown) => console.error(`[mail] review mail to ${r.email} not sent: ${err instanceof Error ? err.message : String(err)}`)),
      ),
    );
  }
}
