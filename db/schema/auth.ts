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
import { shops } from './shops';

export const roleEnum = pgEnum('role', ['lead', 'technician', 'apprentice']);
export type Role = (typeof roleEnum.enumValues)[number];

export const users = pgTable(
  'users',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: uuid()
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    /** Stored lower-cased; one account per address across all shops. */
    email: text().notNull(),
    name: text().notNull(),
    role: roleEnum().notNull(),
    passwordHash: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** Removed members keep their row (their name stays on past records) but cannot sign in. */
    removedAt: timestamp({ withTimezone: true }),
  },
  (t) => [uniqueIndex('users_email_key').on(t.email), index('users_shop_idx').on(t.shopId)],
);

export const sessions = pgTable(
  'sessions',
  {
    /** Hex SHA-256 of the token in the cookie; the token itself is never stored. */
    id: text().primaryKey(),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** Sliding expiry, renewed while the session is used. */
    expiresAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    /** Hard end of the session however active it is. */
    absoluteExpiresAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const invites = pgTable(
  'invites',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: uuid()
      .notNull()
      .references(() => shops.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    role: roleEnum().notNull(),
    /** SHA-256 of the token in the link; the token itself is only ever in the e-mail. */
    tokenHash: text().notNull(),
    invitedById: uuid()
      .notNull()
      .references(() => users.id),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
    revokedAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    uniqueIndex('invites_token_hash_key').on(t.tokenHash),
    index('invites_shop_idx').on(t.shopId),
  ],
);

/**
 * A new shop waiting for its e-mail address to be confirmed: nothing is created until the link in
 * the mail is used, so sign-up answers the same whether or not the address has an account.
 */
export const signUpRequests = pgTable(
  'sign_up_requests',
  {
    id: uuid().primaryKey().defaultRandom(),
    email: text().notNull(),
    /** SHA-256 of the token in the link; the token itself is only ever in the e-mail. */
    tokenHash: text().notNull(),
    /** The rest of the sign-up form (shop name, the person's name, ...), checked again when used. */
    details: jsonb().notNull(),
    passwordHash: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    usedAt: timestamp({ withTimezone: true }),
  },
  (t) => [uniqueIndex('sign_up_requests_token_hash_key').on(t.tokenHash)],
);

/**
 * Failed sign-in counters, one row per key ("account:<email>" or "address:<ip>").
 * Kept in PostgreSQL so every app instance sees the same counts.
 */
export const signInThrottle = pgTable('sign_in_throttle', {
  key: text().primaryKey(),
  failures: integer().notNull().default(0),
  windowStartedAt: timestamp({ withTimezone: true })
    .notNull()
    .default(sql`now()`),
});

export type User = typeof users.$inferSelect;
export type Invite = typeof invites.$inferSelect;
