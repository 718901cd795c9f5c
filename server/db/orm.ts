import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';

/** Opens the ORM and brings the schema up to date (migrations are idempotent). */
export async function openDatabase(overrides: { dbName?: string } = {}): Promise<MikroORM> {
  const orm = await MikroORM.init({ ...config, ...overrides });
  await orm.getMigrator().up();
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
