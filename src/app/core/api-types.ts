/**
 * The API's request and response shapes as the app uses them: shared/api.ts's types, with the design document
 * typed by shared/design.ts where the wire type says `unknown`.
 */
import type {
  DesignDetail,
  RevisionDetail as WireRevisionDetail,
  SignInResponse,
} from '../../../shared/api';
import type { DesignDocument, Region, Shape } from '../../../shared/design';

export type {
  ActivityItem,
  BufferValues,
  Comment,
  DesignSummary,
  Id,
  Invitation,
  InvitationPreview,
  LibraryItem,
  LibraryItemRequest,
  LibraryKind,
  MailDetail,
  MailSummary,
  Member,
  Page,
  PersonRef,
  ReviewState,
  RevisionSummary,
  Role,
  RunDetail,
  RunListItem,
  RunState,
  RunSummary,
  User,
  WallValues,
  Workspace,
} from '../../../shared/api';
export type { DesignDocument, Region, Shape };

export type SessionResponse = SignInResponse;

/** One design with its working document. */
export type Design = Omit<DesignDetail, 'document'> & { document: DesignDocument };

/** A frozen revision with its document. */
export type RevisionDetail = Omit<WireRevisionDetail, 'document'> & { document: DesignDocument };

export interface PageQuery {
  limit?: number;
  offset?: number;
  sort?: string;
  order?: 'asc' | 'desc';
  q?: string;
}
