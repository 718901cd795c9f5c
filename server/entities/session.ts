import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from './user';

const p = defineEntity.properties;

/**
 * A signed-in browser or client. Access tokens carry the session id and stop working when the row is gone;
 * the refresh token is kept as a SHA-256 hash and rotated on every use (the previous hash stays valid for a
 * few seconds so that two tabs refreshing at once do not sign each other out).
 */
export const SessionSchema = defineEntity({
  name: 'Session',
  tableName: 'sessions',
  indexes: [{ properties: ['user'] }],
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    user: p.manyToOne(UserSchema).deleteRule('cascade'),
    refreshHash: p.string().length(64),
    previousHash: p.string().length(64).nullable(),
    rotatedAt: p.datetime().onCreate(() => new Date()),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
  },
});

export type Session = InferEntity<typeof SessionSchema>;

/** A password-reset link; only a SHA-256 hash of its token is kept, and it works once. */
export const PasswordResetSchema = defineEntity({
  name: 'PasswordReset',
  tableName: 'password_resets',
  indexes: [{ properties: ['user'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    user: p.manyToOne(UserSchema).deleteRule('cascade'),
    tokenHash: p.string().length(64).unique(),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
  },
});

export type PasswordReset = InferEntity<typeof PasswordResetSchema>;
