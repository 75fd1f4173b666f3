import {
  boolean,
  doublePrecision,
  integer,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import { users } from './auth';
import { pressureUnitEnum, torqueUnitEnum } from './records';
import { shops } from './shops';

/** How recent a wrench's passing verification must be for the runner to use it. */
export const verificationRecencyEnum = pgEnum('verification_recency', ['same_day', 'within_days']);

/**
 * One row per shop, made by a trigger on `shops` (migration 0003), so every shop, however it was
 * created, has its settings. The column defaults are the product's defaults for a new shop; code
 * reads the row, never a fixed default.
 */
export const shopSettings = pgTable('shop_settings', {
  shopId: uuid()
    .primaryKey()
    .references(() => shops.id, { onDelete: 'cascade' }),
  /** IANA time zone; every date and time shown to a person is in it. */
  timeZone: text().notNull().default('UTC'),
  /** % of a wrench's maximum below which it is not used (0: only its lowest mark limits it). */
  wrenchFloorPercent: doublePrecision().notNull().default(20),
  verificationRecency: verificationRecencyEnum().notNull().default('same_day'),
  /** With `within_days`: a passing verification counts for this many shop days (1 = today only). */
  verificationDays: integer().notNull().default(1),
  /** A verification counts for a pass only when its reference is within ±this % of the setting (0 = any point). */
  verificationNearPercent: doublePrecision().notNull().default(25),
  tooFastSecondsPerBolt: doublePrecision().notNull().default(1.5),
  recheckDays: integer().notNull().default(7),
  pressureUnit: pressureUnitEnum().notNull().default('psi'),
  torqueUnit: torqueUnitEnum().notNull().default('lbf-ft'),
  /** A shop with one lead: may that lead sign off their own work, with a written reason. */
  singleLeadSelfSignoff: boolean().notNull().default(false),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedById: uuid().references(() => users.id),
});

export type ShopSettingsRow = typeof shopSettings.$inferSelect;
