import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/** A person who signs in. Passwords are kept only as bcrypt hashes. */
export const UserSchema = defineEntity({
  name: 'User',
  tableName: 'users',
  properties: {
    id: p.integer().primary().autoincrement(),
    email: p.string().length(320).unique(),
    name: p.string().length(200),
    passwordHash: p.string().length(100),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type User = InferEntity<typeof UserSchema>;
