/**
 * The growth bench's database handles: the app's own client (drizzle over postgres.js with every
 * statement prepared, as db/index.ts builds it) with a hook that records each statement sent, so
 * the statements the real code ran can be explained afterwards. `use()` points the app's getDb()
 * at this database.
 */
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { withPreparedStatements } from '@/db/prepared-statements';
import * as schema from '@/db/schema';

export type Statement = { query: string; parameters: unknown[] };
export type CapturingDb = Awaited<ReturnType<typeof openCapturingDb>>;

const appDb = globalThis as unknown as { ringpassDb?: { db: unknown; sql: postgres.Sql } };

export async function openCapturingDb(url: string) {
  let captured: Statement[] | null = null;
  const sql = postgres(url, {
    max: 10,
    onnotice: () => {},
    // A copy: postgres.js serializes the array in place when it binds, and would again on replay.
    debug: (_connection, query, parameters) =>
      void captured?.push({ query, parameters: [...parameters] }),
  });
  const db = drizzle(withPreparedStatements(sql), { schema, casing: 'snake_case' });
  await sql`select 1`;
  return {
    sql,
    db,
    use: () => void (appDb.ringpassDb = { db, sql }),
    /** Runs `body` and answers the statements it sent (transaction control left out). */
    async capture(body: () => Promise<unknown>): Promise<Statement[]> {
      captured = [];
      try {
        await body();
        return captured.filter(
          (s) => !/^\s*(begin|commit|rollback|savepoint|release)\b/i.test(s.query),
        );
      } finally {
        captured = null;
      }
    },
    close: () => sql.end({ timeout: 5 }),
  };
}

class Rollback extends Error {}

/**
 * EXPLAIN (ANALYZE, BUFFERS) of each statement with the parameters it was sent with, each in a
 * transaction that is rolled back, so an explained insert stores nothing.
 */
export async function explainCaptured(db: CapturingDb, statements: Statement[]): Promise<string> {
  const out: string[] = [];
  for (const s of statements) {
    out.push(`-- ${s.query.replace(/\s+/g, ' ').slice(0, 160)}…`);
    await db.sql
      .begin(async (tx) => {
        const plan = await tx.unsafe(
          `explain (analyze, buffers) ${s.query}`,
          s.parameters as never[],
        );
        out.push(...plan.map((r) => r['QUERY PLAN'] as string));
        throw new Rollback();
      })
      .catch((error: unknown) => {
        if (!(error instanceof Rollback)) throw error;
      });
  }
  return out.join('\n');
}
