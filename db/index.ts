import { drizzle, type PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { env } from '@/server/env.mjs';
import { withPreparedStatements } from './prepared-statements';
import * as schema from './schema';

export type Database = PostgresJsDatabase<typeof schema>;

// One pool per process, created on first use. In development Next re-evaluates modules on
// reload, so the pool is kept on globalThis to avoid leaking connections.
const globalForDb = globalThis as unknown as { ringpassDb?: { db: Database; sql: postgres.Sql } };

function connect() {
  const sql = postgres(env().DATABASE_URL, { max: 10, onnotice: () => {} });
  return { db: drizzle(withPreparedStatements(sql), { schema, casing: 'snake_case' }), sql };
}

export function getDb(): Database {
  globalForDb.ringpassDb ??= connect();
  return globalForDb.ringpassDb.db;
}

/** Closes the pool: for scripts and tests that must exit cleanly. */
export async function closeDb() {
  await globalForDb.ringpassDb?.sql.end({ timeout: 5 });
  globalForDb.ringpassDb = undefined;
}
