/** Workspaces, their members and roles, invitations. */
import type { Id, PersonRef, Timestamp } from './common';

export const ROLES = ['owner', 'editor', 'reviewer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Roles from least to most rights: each role may do everything the ones before it may. */
export const ROLE_RANK: Record<Role, number> = { viewer: 0, reviewer: 1, editor: 2, owner: 3 };

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
