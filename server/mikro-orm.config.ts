import { Migrator } from '@mikro-orm/migrations';
import { defineConfig } from '@mikro-orm/postgresql';
import { loadConfig } from './config';
import { entities } from './entities';

const { database } = loadConfig();

/** One ORM configuration for the server, the migration CLI and the tests. */
export default defineConfig({
  host: database.host,
  port: database.port,
  user: database.user,
  password: database.password,
  dbName: database.dbName,
  entities,
  extensions: [Migrator],
  migrations: {
    path: 'dist/node/server/migrations',
    pathTs: 'server/migrations',
    glob: '!(*.d).{js,ts}',
    transactional: true,
    allOrNothing: true,
    emit: 'ts',
    snapshot: true,
    snapshotName: '.snapshot-osmolane',
    silent: true,
  },
  preferTs: __filename.endsWith('.ts'),
  debug: false,
});
