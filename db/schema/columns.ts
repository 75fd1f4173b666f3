import { timestamp, uuid } from 'drizzle-orm/pg-core';
import { shops } from './shops';

/** The columns every shop-owned table repeats: its shop (gone with the shop) and when the row was made. */
export const shopId = () =>
  uuid()
    .notNull()
    .references(() => shops.id, { onDelete: 'cascade' });
export const createdAt = () => timestamp({ withTimezone: true }).notNull().defaultNow();
