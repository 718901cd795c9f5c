import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { REVIEW_STATES, RUN_STATES, type RunSummary } from '../../shared/api';
import { UserSchema } from './user';
import { WorkspaceSchema } from './workspace';

const p = defineEntity.properties;

/**
 * A chip layout being worked on. `version` goes up by one on every save; a save names the version it started
 * from and is refused when that is stale (see services/designs.ts). The document is kept as sent (json, not
 * jsonb, so key order and unknown fields of later format versions survive).
 */
export const DesignSchema = defineEntity({
  name: 'Design',
  tableName: 'designs',
  indexes: [{ properties: ['workspace', 'updatedAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    workspace: p.manyToOne(WorkspaceSchema).deleteRule('cascade'),
    name: p.string().length(200),
    document: p.json<unknown>().columnType('json'),
    version: p.integer().default(1),
    reviewState: p.enum([...REVIEW_STATES]).default('draft'),
    createdAt: p.datetime().onCreate(() => new Date()),
    createdBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    updatedAt: p.datetime().onCreate(() => new Date()),
    updatedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});

export type Design = InferEntity<typeof DesignSchema>;

/** A frozen copy of a design's document. Never updated: the service never does, and a trigger refuses it. */
export const RevisionSchema = defineEntity({
  name: 'Revision',
  tableName: 'revisions',
  uniques: [{ properties: ['design', 'number'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    design: p.manyToOne(DesignSchema).deleteRule('cascade'),
    number: p.integer(),
    note: p.text().default(''),
    document: p.json<unknown>().columnType('json'),
    createdAt: p.datetime().onCreate(() => new Date()),
    author: p.manyToOne(UserSchema),
  },
});

export type Revision = InferEntity<typeof RevisionSchema>;

/** A solve of a revision: settings, summary (port table, metrics, warnings) and the key of its field blob. */
export const RunSchema = defineEntity({
  name: 'Run',
  tableName: 'runs',
  indexes: [{ properties: ['revision', 'createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    revision: p.manyToOne(RevisionSchema).deleteRule('cascade'),
    status: p.enum([...RUN_STATES]).default('solved'),
    settings: p.json<Record<string, unknown>>(),
    summary: p.json<RunSummary>(),
    blobKey: p.string().length(200).nullable(),
    blobBytes: p.integer().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    author: p.manyToOne(UserSchema),
  },
});

export type Run = InferEntity<typeof RunSchema>;

/** Bytes of the PostgreSQL implementation of the blob store (services/blob-store.ts). */
export const RunBlobSchema = defineEntity({
  name: 'RunBlob',
  tableName: 'run_blobs',
  properties: {
    key: p.string().length(200).primary(),
    bytes: p.blob(),
    size: p.integer(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type RunBlob = InferEntity<typeof RunBlobSchema>;

/** A remark on a revision, optionally pinned to a point of the layout (metres). */
export const CommentSchema = defineEntity({
  name: 'Comment',
  tableName: 'comments',
  indexes: [{ properties: ['revision', 'createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    revision: p.manyToOne(RevisionSchema).deleteRule('cascade'),
    author: p.manyToOne(UserSchema),
    body: p.text(),
    at: p.json<[number, number] | null>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type Comment = InferEntity<typeof CommentSchema>;
