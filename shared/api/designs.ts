/** Designs, their revisions, runs and comments. */
import type { Id, ListQuery, PersonRef, Timestamp } from './common';
import type { Role } from './workspaces';

export const REVIEW_STATES = ['draft', 'in review', 'mask-ready'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const RUN_STATES = ['queued', 'solving', 'solved', 'failed', 'cancelled'] as const;
export type RunState = (typeof RUN_STATES)[number];

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
