import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';
import { ensureBuiltInLibrary } from '../seed/library';

/** Any fixed number: processes opening the same database take turns at migrating it. */
const MIGRATION_LOCK = 0x05_1a_4e;

/**
 * Opens the ORM and brings the database up to date: pending migrations, then the built-in library entries.
 * An advisory lock makes servers and test workers that start together migrate one after the other.
 */
export async function openDatabase(overrides: { dbName?: string } = {}): Promise<MikroORM> {
  const orm = await MikroORM.init({ ...config, ...overrides });
  try {
    await orm.em.getKnex().transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(?)', [MIGRATION_LOCK]);
      await orm.getMigrator().up();
      await ensureBuiltInLibrary(orm);
    });
  } catch (err) {
    await orm.close(true);
    throw err;
  }
  return orm;
}

/** A real round trip to PostgreSQL, for /api/health. */
export async function databaseAnswers(orm: MikroORM): Promise<boolean> {
  try {
    const rows = await orm.em.fork().getConnection().execute<{ one: number }[]>('select 1 as one');
    return rows[0]?.one === 1;
  } catch {
    return false;
  }
}
