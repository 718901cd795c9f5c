import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { DesignSchema } from './design';
import { UserSchema } from './user';

const p = defineEntity.properties;

/**
 * A file kept with a design (the original of an imported drawing): its bytes live in the blob store under
 * `key`; the row holds what the server needs to serve it back. Rows go with their design; the service removes
 * the objects first (services/design-files.ts).
 */
export const DesignFileSchema = defineEntity({
  name: 'DesignFile',
  tableName: 'design_files',
  indexes: [{ properties: ['design', 'createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    design: p.manyToOne(DesignSchema).deleteRule('cascade'),
    kind: p.string().length(32),
    key: p.string().length(200).unique(),
    fileName: p.string().length(255),
    contentType: p.string().length(100),
    size: p.integer(),
    sha256: p.string().length(64),
    createdAt: p.datetime().onCreate(() => new Date()),
    createdBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});

export type DesignFile = InferEntity<typeof DesignFileSchema>;
