import type { ReviewState, Role } from './api-types';

/** viewer < reviewer < editor < owner. */
const RANK: Record<Role, number> = { viewer: 0, reviewer: 1, editor: 2, owner: 3 };

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  editor: 'Editor',
  reviewer: 'Reviewer',
  viewer: 'Viewer',
};

export const ROLE_HINTS: Record<Role, string> = {
  owner: 'everything, plus members and roles',
  editor: 'draws, solves, saves revisions and runs, edits the library',
  reviewer: 'reads, comments, approves for the mask',
  viewer: 'reads designs, runs and history',
};

export function atLeast(role: Role | null | undefined, min: Role): boolean {
  return role != null && RANK[role] >= RANK[min];
}

/** May change the design document, save revisions and runs, and edit the library. */
export function canEdit(role: Role | null | undefined): boolean {
  return atLeast(role, 'editor');
}

/** May comment on revisions. */
export function canComment(role: Role | null | undefined): boolean {
  return atLeast(role, 'reviewer');
}

export function isOwner(role: Role | null | undefined): boolean {
  return role === 'owner';
}

export interface ReviewTransition {
  to: ReviewState;
  label: string;
}

/**
 * The review moves a role may make from a state: editors, reviewers and owners put a draft in review and send
 * it back to draft; only reviewers and owners approve it as mask-ready (from in review).
 */
export function reviewTransitions(role: Role | null | undefined, state: ReviewState): ReviewTransition[] {
  if (!atLeast(role, 'reviewer')) return [];
  const mayApprove = role === 'reviewer' || role === 'owner';
  const moves: ReviewTransition[] = [];
  if (state === 'draft') moves.push({ to: 'in review', label: 'Put in review' });
  if (state === 'in review' && mayApprove) moves.push({ to: 'mask-ready', label: 'Approve as mask-ready' });
  if (state !== 'draft') moves.push({ to: 'draft', label: 'Send back to draft' });
  return moves;
}

/** "Editor", for any role text (table rows are untyped in templates). */
export function roleLabel(role: string | null | undefined): string {
  return role && role in ROLE_LABELS ? ROLE_LABELS[role as Role] : (role ?? '');
}

export function roleHint(role: string | null | undefined): string {
  return role && role in ROLE_HINTS ? ROLE_HINTS[role as Role] : '';
}
