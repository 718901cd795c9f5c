import type { EntityManager } from '@mikro-orm/postgresql';

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
