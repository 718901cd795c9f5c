/** Types and names shared by the app, the server and other API clients (see ../shared/api.md). */

export const ROLES = ['owner', 'editor', 'reviewer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const REVIEW_STATES = ['draft', 'in review', 'mask-ready'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const RUN_STATES = ['queued', 'solving', 'solved', 'failed', 'cancelled'] as const;
export type RunState = (typeof RUN_STATES)[number];

/** Error codes of the `{ error: { code, message, field? } }` body, with their HTTP status. */
export const ERROR_STATUS = {
  invalid: 400,
  'not-signed-in': 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'rate-limited': 429,
  internal: 500,
  unavailable: 503,
} as const;
export type ErrorCode = keyof typeof ERROR_STATUS;

export interface ApiErrorBody {
  error: { code: ErrorCode; message: string; field?: string };
}

export interface HealthResponse {
  status: 'ok' | 'degraded';
  version: string;
  database: 'ok' | 'unreachable';
}

/** Roles from least to most rights: each role may do everything the ones before it may. */
export const ROLE_RANK: Record<Role, number> = { viewer: 0, reviewer: 1, editor: 2, owner: 3 };

export const LIBRARY_KINDS = ['buffer', 'wall'] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];

/** Ids are integers; timestamps are ISO 8601 strings (UTC). */
export type Id = number;
export type Timestamp = string;

/** Who did something, as lists and details show it. */
export interface PersonRef {
  id: Id;
  name: string;
}

/**
 * Lists that can grow answer `{ items, total }`. Every list takes `?limit=&offset=&sort=&order=asc|desc`;
 * lists answered as plain arrays also send the total in the `X-Total-Count` header.
 */
export interface Page<T> {
  items: T[];
  total: number;
}

export interface ListQuery {
  limit?: number;
  offset?: number;
  sort?: string;
  order?: 'asc' | 'desc';
}

// ---- Auth

export interface User {
  id: Id;
  email: string;
  name: string;
}

export interface SignInRequest {
  email: string;
  password: string;
}

/** Sign-in, refresh, sign-up and accepting an invitation all answer this, and set the `osm_refresh` cookie. */
export interface SignInResponse {
  /** Access token for `Authorization: Bearer`; short-lived (15 minutes): refresh before it ends. */
  token: string;
  user: User;
  /** Seconds until the access token expires (added field). */
  expiresIn?: number;
}

export interface SignUpRequest {
  email: string;
  name: string;
  password: string;
}

export interface ChangePasswordRequest {
  currentPassword: string;
  newPassword: string;
}

export interface ResetRequestRequest {
  email: string;
}

export interface ResetPasswordRequest {
  token: string;
  newPassword: string;
}

/** Passwords: 8 to 72 bytes (bcrypt reads no further). */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_BYTES = 72;

// ---- Workspaces, members, invitations

export interface Workspace {
  id: Id;
  name: string;
  /** The caller's role in it. */
  role: Role;
}

export interface CreateWorkspaceRequest {
  name: string;
}

export interface Member {
  userId: Id;
  email: string;
  name: string;
  role: Role;
}

export interface ChangeRoleRequest {
  role: Role;
}

export interface Invitation {
  id: Id;
  email: string;
  role: Role;
  createdAt: Timestamp;
  expiresAt: Timestamp;
  acceptedAt: Timestamp | null;
  invitedBy?: PersonRef;
}

export interface InviteRequest {
  email: string;
  role: Role;
}

/** GET /api/invitations/:token, readable without signing in. */
export interface InvitationPreview {
  workspaceName: string;
  email: string;
  role: Role;
  /** True when an account with this e-mail exists: accept with its password (or while signed in as it). */
  accountExists: boolean;
}

/** New account: name and password. Existing account: its password, or none when signed in as that account. */
export interface AcceptInvitationRequest {
  name?: string;
  password?: string;
}

// ---- Designs, revisions, runs, comments

export interface DesignSummary {
  id: Id;
  name: string;
  version: number;
  reviewState: ReviewState;
  updatedAt: Timestamp;
  updatedBy?: PersonRef | null;
}

export type DesignSort = 'name' | 'updatedAt' | 'reviewState';

export interface DesignListQuery extends ListQuery {
  sort?: DesignSort;
  /** Case-insensitive filter on the name. */
  q?: string;
}

/** The design document is shared/design.ts's format (`osmolane.design/1`), stored exactly as sent. */
export interface DesignDetail {
  id: Id;
  name: string;
  version: number;
  document: unknown;
  reviewState: ReviewState;
  workspaceId?: Id;
  /** The caller's role in the design's workspace. */
  role?: Role;
  createdAt?: Timestamp;
  updatedAt?: Timestamp;
  updatedBy?: PersonRef | null;
}

export interface CreateDesignRequest {
  name: string;
  document: unknown;
}

export interface SaveDesignRequest {
  document: unknown;
  /** The version the edit started from; a stale one answers 409 and nothing is written. */
  version: number;
  name?: string;
}

export interface ReviewRequest {
  state: ReviewState;
}

export interface CreateRevisionRequest {
  note?: string;
}

export interface RevisionCreated {
  id: Id;
  number: number;
}

export interface RevisionSummary {
  id: Id;
  number: number;
  note: string;
  createdAt: Timestamp;
  author: PersonRef;
}

export interface RevisionDetail extends RevisionSummary {
  designId: Id;
  document: unknown;
}

/** A run's summary: the port table, metrics and warnings of the solve (the CLI's --json result, less the fields). */
export interface RunSummary {
  ports?: { id: string; potential?: number | null; current?: number; flowRate?: number }[];
  metrics?: Record<string, number | null>;
  warnings?: { code: string; message: string }[];
  [key: string]: unknown;
}

export interface CreateRunRequest {
  settings: Record<string, unknown>;
  summary: RunSummary;
  /** Base64 of the compressed binary field blob; read back bit for bit from GET /api/runs/:id/fields. */
  fields?: string;
  /** Defaults to "solved". */
  status?: RunState;
}

export interface RunCreated {
  id: Id;
}

export interface RunListItem {
  id: Id;
  status: RunState;
  summary: RunSummary;
  createdAt: Timestamp;
  author?: PersonRef;
  hasFields?: boolean;
}

export interface RunDetail {
  id: Id;
  revisionId: Id;
  status: RunState;
  settings: Record<string, unknown>;
  summary: RunSummary;
  createdAt: Timestamp;
  author: PersonRef;
  hasFields: boolean;
  /** Size of the field blob in bytes (added field). */
  fieldsBytes?: number | null;
}

export interface Comment {
  id: Id;
  body: string;
  /** A point of the layout (m) the comment is pinned to. */
  at: [number, number] | null;
  createdAt: Timestamp;
  author: PersonRef;
}

export interface CreateCommentRequest {
  body: string;
  at?: [number, number] | null;
}

// ---- Library

export interface BufferValues {
  relativePermittivity?: number;
  /** Pa s */
  viscosity?: number;
  /** kg/m^3 */
  density?: number;
  /** S/m */
  conductivity?: number;
  /** mol/m^3 */
  ionicStrength?: number;
  /** K */
  temperature?: number;
}

/** Wall materials: zeta (V) and electroosmotic mobility (m^2/(V s)), as a typical value and/or a range. */
export interface WallValues {
  zeta?: number;
  zetaMin?: number;
  zetaMax?: number;
  mobility?: number;
  mobilityMin?: number;
  mobilityMax?: number;
  /** Conditions the values hold for, or a caution. */
  note?: string;
}

export interface LibraryItem {
  id: Id;
  kind: LibraryKind;
  name: string;
  values: BufferValues | WallValues;
  source: string;
  /** Built-in entries come from the project's reference values and are read-only. */
  builtIn: boolean;
}

export interface LibraryItemRequest {
  kind: LibraryKind;
  name: string;
  values: BufferValues | WallValues;
  source?: string;
}

// ---- Activity

export interface ActivityItem {
  id: Id;
  /** e.g. `design.created`, `design.saved`, `revision.created`, `run.stored`, `comment.added`, `review.changed`, `member.joined`. */
  kind: string;
  message: string;
  createdAt: Timestamp;
  actor: PersonRef | null;
  designId?: Id | null;
}

export interface ActivityQuery extends ListQuery {
  designId?: Id;
}

// ---- Development mailbox (not in production)

export interface MailSummary {
  id: string;
  to: string[];
  subject: string;
  date: Timestamp;
}

export interface MailDetail extends MailSummary {
  from: string;
  text: string;
  html: string;
}
