import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { jobs, jobWheels } from './records';
import { shops } from './shops';

/**
 * A lead's acknowledgement of an anomaly that blocks sign-off, written with the sign-off in one
 * transaction: which anomaly (its stable key and the sentence as the lead read it), why it is
 * acceptable, who and when. The sign-off's job event carries the same reasons for the history.
 */
export const anomalyAcknowledgements = pgTable(
  'anomaly_acknowledgements',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: uuid()
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    /** Null for an anomaly of the job as a whole (VIN, axle). */
    wheelId: uuid().references(() => jobWheels.id, { onDelete: 'cascade' }),
    anomalyKey: text().notNull(),
    code: text().notNull(),
    message: text().notNull(),
    reason: text().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('anomaly_acknowledgements_job_idx').on(t.shopId, t.jobId, t.at)],
);
