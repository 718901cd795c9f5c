import type { MikroORM } from '@mikro-orm/postgresql';
import type { ServerConfig } from '../config';
import type { Mailer } from '../mail/mailer';
import { AccessService } from './access';
import { ActivityService } from './activity';
import { AuthService } from './auth';
import { PgBlobStore, type BlobStore } from './blob-store';
import { DesignService } from './designs';
import { InvitationService } from './invitations';
import { LibraryService } from './library';
import { RevisionService } from './revisions';
import { RunService } from './runs';
import { WorkspaceService } from './workspaces';

export interface Services {
  access: AccessService;
  activity: ActivityService;
  auth: AuthService;
  workspaces: WorkspaceService;
  invitations: InvitationService;
  designs: DesignService;
  revisions: RevisionService;
  runs: RunService;
  library: LibraryService;
}

export interface ServiceDeps {
  orm: MikroORM;
  config: ServerConfig;
  mailer: Mailer;
  /** Defaults to the PostgreSQL blob store. */
  blobs?: BlobStore;
}

export function createServices({ orm, config, mailer, blobs = new PgBlobStore(orm) }: ServiceDeps): Services {
  const activity = new ActivityService(orm);
  const auth = new AuthService(orm, config, mailer);
  const workspaces = new WorkspaceService(orm, activity);
  return {
    access: new AccessService(orm),
    activity,
    auth,
    workspaces,
    invitations: new InvitationService(orm, config, mailer, auth, workspaces, activity),
    designs: new DesignService(orm, config, mailer, activity),
    revisions: new RevisionService(orm, activity),
    runs: new RunService(orm, blobs, activity),
    library: new LibraryService(orm, activity),
  };
}
