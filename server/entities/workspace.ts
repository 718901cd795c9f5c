import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { ROLES } from '../../shared/api';
import { UserSchema } from './user';

const p = defineEntity.properties;

/** A team's shared space: designs, library entries and members live in one. */
export const WorkspaceSchema = defineEntity({
  name: 'Workspace',
  tableName: 'workspaces',
  properties: {
    id: p.integer().primary().autoincrement(),
    name: p.string().length(200),
    createdAt: p.datetime().onCreate(() => new Date()),
    createdBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});

export type Workspace = InferEntity<typeof WorkspaceSchema>;

/** A person's role in a workspace; one row per person and workspace. */
export const MembershipSchema = defineEntity({
  name: 'Membership',
  tableName: 'memberships',
  uniques: [{ properties: ['workspace', 'user'] }],
  indexes: [{ properties: ['user'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    workspace: p.manyToOne(WorkspaceSchema).deleteRule('cascade'),
    user: p.manyToOne(UserSchema).deleteRule('cascade'),
    role: p.enum([...ROLES]),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});

export type Membership = InferEntity<typeof MembershipSchema>;

/** An invitation by e-mail; only a SHA-256 hash of the link's token is kept. */
export const InvitationSchema = defineEntity({
  name: 'Invitation',
  tableName: 'invitations',
  indexes: [{ properties: ['workspace', 'email'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    workspace: p.manyToOne(WorkspaceSchema).deleteRule('cascade'),
    email: p.string().length(320),
    role: p.enum([...ROLES]),
    tokenHash: p.string().length(64).unique(),
    invitedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    acceptedBy: p.manyToOne(UserSchema).nullable().deleteRule('set null'),
  },
});

export type Invitation = InferEntity<typeof InvitationSchema>;
