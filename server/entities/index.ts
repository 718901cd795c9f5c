import { CommentSchema, DesignSchema, RevisionSchema, RunBlobSchema, RunSchema } from './design';
import { DesignFileSchema } from './design-file';
import { ActivityEventSchema, LibraryItemSchema } from './library';
import { PasswordResetSchema, SessionSchema } from './session';
import { SweepPointSchema, SweepSchema } from './sweep';
import { UserSchema } from './user';
import { InvitationSchema, MembershipSchema, WorkspaceSchema } from './workspace';

/** Every entity of the server, listed explicitly (no folder scanning). */
export const entities = [
  UserSchema,
  WorkspaceSchema,
  MembershipSchema,
  InvitationSchema,
  SessionSchema,
  PasswordResetSchema,
  DesignSchema,
  RevisionSchema,
  RunSchema,
  RunBlobSchema,
  CommentSchema,
  LibraryItemSchema,
  ActivityEventSchema,
  DesignFileSchema,
  SweepSchema,
  SweepPointSchema,
];
