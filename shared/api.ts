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
  ports?: { id: string; potential?: number | null; current?: number; flowRate?: number; /** m/s (added field). */ meanSpeed?: number }[];
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

// ---- Sweeps (capability 11: one or two parameters of a revision's document varied over a range)

/** Outputs a sweep can plot and tabulate; every point keeps its whole summary, outputs choose what is shown. */
export const SWEEP_OUTPUTS = ['portCurrents', 'portFlowRates', 'maxField', 'maxVorticity', 'joulePower', 'warnings'] as const;
export type SweepOutput = (typeof SWEEP_OUTPUTS)[number];

/** How a sweep was answered: at once from unit responses (linear parameters), or one queued job per point. */
export type SweepMethod = 'superposed' | 'jobs';

export type SweepRange =
  | { kind: 'linear'; from: number; to: number; steps: number }
  /** Geometric steps from `from` to `to` (both of one sign, neither zero). */
  | { kind: 'log'; from: number; to: number; steps: number }
  | { kind: 'list'; values: number[] };

export interface SweepParameter {
  /** RFC 6901 JSON pointer to a number in the design document, e.g. `/ports/0/potential` or `/shapes/2/width`. */
  pointer: string;
  range: SweepRange;
}

/** POST /api/sweeps. */
export interface SweepRequest {
  revisionId: Id;
  /** One parameter (curves) or two (maps); at most 400 points in all. */
  parameters: SweepParameter[];
  outputs: SweepOutput[];
  /** Grid cells along the longer side of the layout (default 120). */
  cells?: number;
}

/** A parameter as a sweep reports it: what it points at, in words, with its unit kind and every value taken. */
export interface SweepParameterInfo extends SweepParameter {
  label: string;
  /** The quantity's kind, named as the app's unit formatter names dimensions ('length', 'potential', ...). */
  dimension: string;
  values: number[];
}

/** What one point of a sweep found (SI units, signs as a run's summary). */
export interface SweepPointResult {
  ports: { id: string; potential: number | null; current: number; flowRate: number }[];
  metrics: { joulePower: number; maxField: number; maxVorticity: number; maxSpeed: number };
  warnings: { code: string; message: string }[];
  grid?: { nx: number; ny: number; spacing: number };
}

export interface SweepPoint {
  /** Point k of a sweep: parameter 1 varies fastest (k = i1 + n1 * i2). */
  index: number;
  values: number[];
  status: RunState;
  result: SweepPointResult | null;
  error: string | null;
  /** How many times a worker started this point (more than 1 after a retry). */
  attempts: number;
  /** Solve time of the point (s), as the worker measured it. */
  seconds: number | null;
  /** The run this point was opened as, once someone opened it. */
  runId: Id | null;
}

export interface SweepSummary {
  id: Id;
  designId: Id;
  revisionId: Id;
  revisionNumber: number;
  status: RunState;
  method: SweepMethod;
  parameters: SweepParameterInfo[];
  outputs: SweepOutput[];
  cells: number;
  total: number;
  /** Points finished (solved or failed). */
  done: number;
  failed: number;
  /** Why the whole sweep failed or stopped, when it did. */
  message: string | null;
  createdAt: Timestamp;
  finishedAt: Timestamp | null;
  author: PersonRef;
}

export interface SweepDetail extends SweepSummary {
  points: SweepPoint[];
}

/**
 * GET /api/sweeps/:id/events (text/event-stream, bearer token): `snapshot` (a SweepDetail) first, then `point`
 * (a SweepPoint) and `status` (the summary) as they change; the stream ends after the sweep reaches solved,
 * failed or cancelled.
 */
export type SweepEvent =
  | { type: 'snapshot'; sweep: SweepDetail }
  | { type: 'point'; point: SweepPoint }
  | { type: 'status'; sweep: SweepSummary };

// ---- Files: imported drawings, exports, reports (issue 8)

/** What an imported drawing gave: counts, the units used, and everything skipped with where it is (m). */
export interface ImportReport {
  format: 'svg' | 'dxf';
  metresPerUnit: number;
  unitsSource: string;
  found: { loops: number; add: number; subtract: number; circles: number; sectors: number; polygons: number; ports: number; wallZones: number };
  skipped: { entity: string; at: [number, number] | null; reason: string }[];
  bounds: [number, number, number, number];
}

/** POST /api/workspaces/:wid/designs/import with preview=1: the parsed document, nothing stored. */
export interface ImportPreview {
  document: unknown;
  report: ImportReport;
}

/** POST /api/workspaces/:wid/designs/import: the new design and what the import found. */
export interface ImportCreated {
  design: DesignDetail;
  report: ImportReport;
}

/** A file kept with a design (the original of an imported drawing). */
export interface DesignFileInfo {
  id: Id;
  designId: Id;
  kind: string;
  fileName: string;
  contentType: string;
  size: number;
  sha256: string;
  createdAt: Timestamp;
  createdBy: string | null;
}

export const RUN_EXPORT_FORMATS = ['csv', 'vtk', 'svg', 'png'] as const;
export type RunExportFormat = (typeof RUN_EXPORT_FORMATS)[number];
export const MAP_QUANTITY_NAMES = ['potential', 'fieldStrength', 'speed', 'vorticity', 'pressure', 'streamfunction'] as const;
export type MapQuantityName = (typeof MAP_QUANTITY_NAMES)[number];
