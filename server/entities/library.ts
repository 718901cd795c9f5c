import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { LIBRARY_KINDS } from '../../shared/api';
import { DesignSchema } from './design';
import { UserSchema } from './user';
import { WorkspaceSchema } from './workspace';

const p = defineEntity.properties;

/** A buffer or wall material. Built-in entries have no workspace and a stable `builtInKey`. */
export const LibraryItemSchema = defineEntity({
  name: 'LibraryItem',
  tableName: 'library_items',
  indexes: [{ properties: ['workspace'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    workspace: p.manyToOne(WorkspaceSchema).nullable().deleteRule('cascade'),
    builtInKey: p.string().length(64).nullable().unique(),
    kind: p.enum([...LIBRARY_KINDS]),
    name: p.string().length(200),
    values: p.json<Record<string, unknown>>(),
    source: p.text().default(''),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
    createdBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});

export type LibraryItem = InferEntity<typeof LibraryItemSchema>;

/** One line of a workspace's activity log. */
export const ActivityEventSchema = defineEntity({
  name: 'ActivityEvent',
  tableName: 'activity_events',
  indexes: [{ properties: ['workspace', 'createdAt'] }, { properties: ['design', 'createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    workspace: p.manyToOne(WorkspaceSchema).deleteRule('cascade'),
    actor: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    design: p.manyToOne(DesignSchema).nullable().deleteRule('set null'),
    kind: p.string().length(64),
    message: p.text(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type ActivityEvent = InferEntity<typeof ActivityEventSchema>;
