import type { MikroORM } from '@mikro-orm/postgresql';
import type { ServerConfig } from '../config';
import { SweepQueue } from '../jobs/queue';
import { SolverPool } from '../jobs/solver-pool';
import type { Mailer } from '../mail/mailer';
import { AccessService } from './access';
import { ActivityService } from './activity';
import { AuthService } from './auth';
import { PgBlobStore, type BlobStore } from './blob-store';
import { DesignFileService } from './design-files';
import { DesignService } from './designs';
import { InvitationService } from './invitations';
import { LibraryService } from './library';
import { RevisionService } from './revisions';
import { RunExportService } from './run-exports';
import { RunService } from './runs';
import { SweepEvents } from './sweep-events';
import { SweepService } from './sweeps';
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
  sweeps: SweepService;
  sweepEvents: SweepEvents;
  /** Ends what runs beside the requests: sweep event streams, the job queue's connections, solver threads. */
  stop(): Promise<void>;
  files: DesignFileService;
  exports: RunExportService;
}

export interface ServiceDeps {
  orm: MikroORM;
  config: ServerConfig;
  mailer: Mailer;
  /** Defaults to the PostgreSQL blob store. */
  blobs?: BlobStore;
  /** Defaults to pg-boss on the server's database with config.sweeps (started on first use). */
  queue?: SweepQueue;
}

export function createServices(deps: ServiceDeps): Services {
  const { orm, config, mailer, blobs = new PgBlobStore(orm) } = deps;
  const activity = new ActivityService(orm);
  const auth = new AuthService(orm, config, mailer);
  const workspaces = new WorkspaceService(orm, activity);
  const runs = new RunService(orm, blobs, activity);
  const queue = deps.queue ?? new SweepQueue(config.database, config.sweeps);
  // One solver thread for sweeps answered by superposition, so the unit solves never hold up requests.
  const pool = new SolverPool(1);
  const sweepEvents = new SweepEvents(orm);
  const access = new AccessService(orm);
  const designs = new DesignService(orm, config, mailer, activity, access);
  return {
    access,
    activity,
    auth,
    workspaces,
    invitations: new InvitationService(orm, config, mailer, auth, workspaces, activity),
    designs,
    revisions: new RevisionService(orm, activity),
    runs,
    library: new LibraryService(orm, activity),
    sweeps: new SweepService(orm, queue, pool, runs, activity),
    sweepEvents,
    async stop() {
      sweepEvents.close();
      await Promise.all([queue.stop(), pool.close()]);
    },
    files: new DesignFileService(orm, blobs, activity, designs),
    exports: new RunExportService(orm, config),
  };
}
