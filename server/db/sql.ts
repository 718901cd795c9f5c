import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';

/**
 * Plain SQL beside the ORM, for reads with joins and for conditional updates. Parameters are `?` placeholders;
 * MikroORM escapes them into the statement, so keep large values (blobs) out of here (see services/blob-store.ts).
 * Run inside `em.transactional(...)`, these use the transaction's connection.
 */
export async function queryRows<T>(em: EntityManager, sql: string, params: unknown[] = []): Promise<T[]> {
  return em.execute<T[]>(sql, params, 'all');
}

export async function queryRow<T>(em: EntityManager, sql: string, params: unknown[] = []): Promise<T | undefined> {
  const rows = await queryRows<T>(em, sql, params);
  return rows[0];
}

interface PgClient {
  query(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }>;
}

/** Statement names by SQL text; the same text gets the same name on every pooled connection. */
const statements = new Map<string, string>();

/**
 * A read on a hot path (the API's most frequent GETs) as a named prepared statement on a pooled connection:
 * PostgreSQL parses and plans it once per connection instead of on every call, which for these small indexed
 * reads costs more than running them. Placeholders are `$1, $2, …` and the values travel apart from the text,
 * as numbers, strings or null (no arrays or objects). It takes its own connection, so never inside a transaction;
 * everything else uses queryRows.
 */
export async function preparedRows<T>(orm: MikroORM, sql: string, params: (string | number | null)[]): Promise<T[]> {
  let name = statements.get(sql);
  if (!name) statements.set(sql, (name = `osmolane_${statements.size + 1}`));
  const client = orm.em.getKnex().client;
  const connection = (await client.acquireConnection()) as PgClient;
  try {
    return (await connection.query({ name, text: sql, values: params })).rows as T[];
  } finally {
    await client.releaseConnection(connection);
  }
}

export async function preparedRow<T>(orm: MikroORM, sql: string, params: (string | number | null)[]): Promise<T | undefined> {
  return (await preparedRows<T>(orm, sql, params))[0];
}

/** Runs an INSERT/UPDATE/DELETE and answers how many rows it touched. */
export async function run(em: EntityManager, sql: string, params: unknown[] = []): Promise<number> {
  const result = await em.execute<{ affectedRows: number }>(sql, params, 'run');
  return result.affectedRows;
}

export function iso(value: Date | string): string {
  return (value instanceof Date ? value : new Date(value)).toISOString();
}

/** `%text%` for ILIKE, with the pattern characters of the text taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
