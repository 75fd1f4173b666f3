import { sql } from 'drizzle-orm';
import {
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { users } from './auth';
import { wheelSpecs } from './records';
import { createdAt, shopId } from './columns';

/**
 * Practice lives in its own tables, keyed by shop and person: nothing here is reachable through a
 * job, the board, sign-off, reports or the tool crib, and nothing there is written by practice.
 */
export const practiceLevelEnum = pgEnum('practice_level', [
  'guided',
  'from_memory',
  'wrench_setup',
]);
export const practiceSourceEnum = pgEnum('practice_source', ['spec', 'surprise']);

/** One go at a simulated wheel. `setup` is fixed when it starts; `result` when it is finished. */
export const practiceAttempts = pgTable(
  'practice_attempts',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    level: practiceLevelEnum().notNull(),
    source: practiceSourceEnum().notNull(),
    /** The shop's spec it was drawn from (null for "surprise me", or when the spec is deleted). */
    specId: uuid().references(() => wheelSpecs.id, { onDelete: 'set null' }),
    /** The simulated wheel: spec values, pass plan and the wrenches on offer, as the runner reads them. */
    setup: jsonb().$type<Record<string, unknown>>().notNull(),
    startedAt: createdAt(),
    finishedAt: timestamp({ withTimezone: true }),
    /** 0–100, set when finished. */
    score: integer(),
    /** The scoring module's breakdown and mistakes, set when finished. */
    result: jsonb().$type<Record<string, unknown>>(),
  },
  (t) => [index('practice_attempts_person_idx').on(t.shopId, t.userId, t.startedAt)],
);

/**
 * What the apprentice did, in the runner's event shape; a replayed event (same client id) is stored
 * once. Keyed by the device's time-ordered id, as wheel_run_events is.
 */
export const practiceEvents = pgTable(
  'practice_events',
  {
    shopId: shopId(),
    attemptId: uuid()
      .notNull()
      .references(() => practiceAttempts.id, { onDelete: 'cascade' }),
    clientId: uuid().primaryKey(),
    type: text().notNull(),
    payload: jsonb().$type<Record<string, unknown>>().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    clientAt: timestamp({ withTimezone: true }).notNull(),
    deviceAt: timestamp({ withTimezone: true }),
    deviceId: uuid(),
    receivedAt: createdAt(),
  },
  (t) => [index('practice_events_attempt_idx').on(t.attemptId, t.clientAt)],
);

/**
 * A lead's word that an apprentice may run real wheels: who and when, revocable (the row stays,
 * with who revoked it and when). At most one standing clearance per person.
 */
export const practiceClearances = pgTable(
  'practice_clearances',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    clearedById: uuid()
      .notNull()
      .references(() => users.id),
    clearedAt: createdAt(),
    note: text().notNull().default(''),
    revokedById: uuid().references(() => users.id),
    revokedAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    index('practice_clearances_person_idx').on(t.shopId, t.userId, t.clearedAt),
    uniqueIndex('practice_clearances_standing_key')
      .on(t.userId)
      .where(sql`${t.revokedAt} is null`),
  ],
);
