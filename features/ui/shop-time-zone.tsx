'use client';

import { createContext, useContext, useMemo, type ReactNode } from 'react';
import {
  dayStatus,
  dueStatus,
  formatShopDay,
  formatShopTime,
  fromShopLocal,
  shopDay,
  toShopLocal,
  type TimeStyle,
} from './shop-time';

const ShopTimeZoneContext = createContext<string | null>(null);

/** Set once per layout from the shop's settings, so client components read the shop's clock. */
export function ShopTimeZoneProvider({
  timeZone,
  children,
}: {
  timeZone: string;
  children: ReactNode;
}) {
  return <ShopTimeZoneContext.Provider value={timeZone}>{children}</ShopTimeZoneContext.Provider>;
}

type When = Date | string | number;

/**
 * The shop's clock in a client component. Outside a provider it throws: silently falling back
 * to the browser's or UTC's clock is exactly the mistake this exists to prevent.
 */
export function useShopTime() {
  const timeZone = useContext(ShopTimeZoneContext);
  if (!timeZone)
    throw new Error(
      'useShopTime needs a ShopTimeZoneProvider (set in the layout from the shop settings).',
    );
  return useMemo(
    () => ({
      timeZone,
      format: (when: When, style?: TimeStyle) => formatShopTime(when, timeZone, style),
      day: (when: When) => shopDay(when, timeZone),
      toLocalInput: (iso: string | null | undefined) => (iso ? toShopLocal(iso, timeZone) : ''),
      /** A `datetime-local` value typed at the shop → ISO instant ('' stays '', bad text stays as typed for the server to refuse). */
      fromLocalInput: (value: string) =>
        value ? (fromShopLocal(value, timeZone)?.toISOString() ?? value) : '',
      dueStatus: (dueAt: When, now = new Date()) => dueStatus(dueAt, { timeZone, now }),
      dayStatus: (day: string, now = new Date()) => dayStatus(day, { timeZone, now }),
    }),
    [timeZone],
  );
}

/** A `<time>` showing an instant on the shop's clock; usable from server components too. */
export function ShopTime({
  when,
  style = 'dateTime',
  className,
}: {
  when: string;
  style?: TimeStyle;
  className?: string;
}) {
  const { format } = useShopTime();
  return (
    <time dateTime={when} className={className}>
      {format(when, style)}
    </time>
  );
}

/** A calendar date with no instant behind it (a calibration due date), e.g. "Mar 8, 2026". */
export function ShopDate({ day }: { day: string }) {
  return <time dateTime={day}>{formatShopDay(day)}</time>;
}
