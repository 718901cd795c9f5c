/** The activity feed of a workspace or design. */
import type { Id, ListQuery, PersonRef, Timestamp } from './common';

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
