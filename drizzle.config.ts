import { defineConfig } from 'drizzle-kit';

// `drizzle-kit generate` only diffs the schema against the committed snapshots;
// it never connects, so no database URL is needed here.
export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema/index.ts',
  out: './db/migrations',
  casing: 'snake_case',
});
