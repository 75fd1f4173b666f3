import {
  date,
  index,
  integer,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { users } from './auth';
import { jobs } from './records';
import { createdAt, shopId } from './columns';

// What a signed-off job sends the customer: the report link, the e-mail, the re-check reminder.

/** `/r/<token>`: the customer's view of one job's report, without an account. */
export const reportLinks = pgTable(
  'report_links',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    /** SHA-256 of the token in the link; the token itself is only in the e-mail and on screen once. */
    tokenHash: text().notNull(),
    createdById: uuid()
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    revokedById: uuid().references(() => users.id),
    revokedAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    uniqueIndex('report_links_token_hash_key').on(t.tokenHash),
    index('report_links_job_idx').on(t.shopId, t.jobId),
  ],
);

export const deliveryStatusEnum = pgEnum('delivery_status', ['queued', 'sent', 'failed']);

/** The customer's completion e-mail (report attached, link inside), one per job, sent from the queue. */
export const customerReportEmails = pgTable('customer_report_emails', {
  jobId: uuid()
    .primaryKey()
    .references(() => jobs.id, { onDelete: 'cascade' }),
  shopId: shopId(),
  toAddress: text().notNull(),
  status: deliveryStatusEnum().notNull().default('queued'),
  attempts: integer().notNull().default(0),
  lastError: text(),
  queuedAt: createdAt(),
  sentAt: timestamp({ withTimezone: true }),
  updatedAt: createdAt(),
});

export const recheckStatusEnum = pgEnum('recheck_status', [
  'scheduled',
  'sent',
  'failed',
  'cancelled',
]);

/** The ring-bolt re-check reminder for a signed-off job, due the shop's re-check days later. */
export const recheckReminders = pgTable(
  'recheck_reminders',
  {
    jobId: uuid()
      .primaryKey()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    shopId: shopId(),
    /** The shop's calendar day it is due on. */
    dueOn: date({ mode: 'string' }).notNull(),
    status: recheckStatusEnum().notNull().default('scheduled'),
    attempts: integer().notNull().default(0),
    lastError: text(),
    sentAt: timestamp({ withTimezone: true }),
    changedById: uuid().references(() => users.id),
    updatedAt: createdAt(),
  },
  (t) => [index('recheck_reminders_due_idx').on(t.shopId, t.status, t.dueOn)],
);
