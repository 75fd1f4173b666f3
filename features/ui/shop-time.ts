/**
 * The shop's clock: every date and time shown to a person, and every "today" the product
 * computes, is on the shop's calendar in its IANA time zone — not the browser's, not the
 * database server's. Pure (Intl only), so server code, client components and tests share it.
 * API JSON stays ISO 8601 instants; only what a person reads goes through here.
 */

/**
 * One fixed locale on server and browser alike: a server-rendered time must read the same after
 * hydration, whatever language the phone is set to.
 */
export const SHOP_LOCALE = 'en-US';

export type TimeStyle = 'dateTime' | 'date' | 'time' | 'weekdayDate';

const STYLES: Record<TimeStyle, Intl.DateTimeFormatOptions> = {
  dateTime: { dateStyle: 'medium', timeStyle: 'short' },
  date: { dateStyle: 'medium' },
  time: { timeStyle: 'short' },
  weekdayDate: { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' },
};

const formatters = new Map<string, Intl.DateTimeFormat>();

/** Building a formatter costs far more than using one: one per zone and style, kept. */
function formatter(
  timeZone: string,
  style: TimeStyle | 'parts' | 'long' | 'zone',
): Intl.DateTimeFormat {
  const key = `${timeZone}|${style}`;
  let f = formatters.get(key);
  if (!f) {
    const options: Intl.DateTimeFormatOptions =
      style === 'parts'
        ? {
            year: 'numeric',
            month: '2-digit',
            day: '2-digit',
            hour: '2-digit',
            minute: '2-digit',
            second: '2-digit',
            hourCycle: 'h23',
          }
        : style === 'long'
          ? { dateStyle: 'long', timeStyle: 'short' }
          : style === 'zone'
            ? { timeZoneName: 'long' }
            : STYLES[style];
    f = new Intl.DateTimeFormat(SHOP_LOCALE, { ...options, timeZone });
    formatters.set(key, f);
  }
  return f;
}

type When = Date | string | number;
const toDate = (when: When) => (when instanceof Date ? when : new Date(when));

/** A date and time as the shop reads it, e.g. "Mar 8, 2026, 3:30 AM" (no zone name: it is the shop's). */
export function formatShopTime(
  when: When,
  timeZone: string,
  style: TimeStyle = 'dateTime',
): string {
  return plainSpaces(formatter(timeZone, style).format(toDate(when)));
}

/**
 * Newer ICU puts a narrow no-break space before "AM"; browsers and Node differ on it, and a
 * server-rendered time must match the browser's text exactly when React hydrates it.
 */
const plainSpaces = (text: string) => text.replace(/[\u202f\u00a0]/g, ' ');

const UNIVERSAL = new Set([
  'UTC',
  'Etc/UTC',
  'Etc/UCT',
  'UCT',
  'Etc/Universal',
  'Universal',
  'Etc/Zulu',
  'Zulu',
  'GMT',
  'Etc/GMT',
  'Etc/GMT0',
  'Etc/GMT+0',
  'Etc/GMT-0',
  'Etc/Greenwich',
  'Greenwich',
]);

/** The zone as a person reads it beside a form: "America/Denver", "Coordinated Universal Time". */
export function zoneLabel(timeZone: string): string {
  return UNIVERSAL.has(timeZone) ? 'Coordinated Universal Time' : timeZone.replaceAll('_', ' ');
}

/**
 * For an e-mail, read away from the shop: the zone's own long name ("Mountain Standard Time"),
 * so the reader can tell it is the shop's time, never an abbreviation to decode.
 */
export function formatShopTimeForMail(when: When, timeZone: string): string {
  const text = plainSpaces(formatter(timeZone, 'long').format(toDate(when)));
  const zone = formatter(timeZone, 'zone')
    .formatToParts(toDate(when))
    .find((p) => p.type === 'timeZoneName')?.value;
  return zone ? `${text} ${zone}` : text;
}

type Wall = {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
};

/** The wall clock in the zone at an instant. */
function wallClock(instant: number, timeZone: string): Wall {
  const get: Record<string, number> = {};
  for (const p of formatter(timeZone, 'parts').formatToParts(new Date(instant)))
    if (p.type !== 'literal') get[p.type] = Number(p.value);
  return {
    year: get.year!,
    month: get.month!,
    day: get.day!,
    hour: get.hour! % 24,
    minute: get.minute!,
    second: get.second!,
  };
}

const wallAsUtc = (w: Wall) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
const pad = (n: number, width = 2) => String(n).padStart(width, '0');
const dayText = (w: Pick<Wall, 'year' | 'month' | 'day'>) =>
  `${pad(w.year, 4)}-${pad(w.month)}-${pad(w.day)}`;

/** The zone's offset from UTC at an instant, in ms (Denver in winter: −7 h). */
function offsetAt(instant: number, timeZone: string): number {
  const whole = Math.floor(instant / 1000) * 1000;
  return wallAsUtc(wallClock(whole, timeZone)) - whole;
}

/** The shop's calendar day at an instant, 'YYYY-MM-DD'. */
export function shopDay(when: When, timeZone: string): string {
  return dayText(wallClock(toDate(when).getTime(), timeZone));
}

/** A calendar day moved by whole days ('2026-02-28' + 1 = '2026-03-01'); days have no zone. */
export function addDays(day: string, days: number): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  const t = new Date(Date.UTC(y, m - 1, d + days));
  return dayText({ year: t.getUTCFullYear(), month: t.getUTCMonth() + 1, day: t.getUTCDate() });
}

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/**
 * The instant a wall-clock time names in the zone (a `datetime-local` value typed at the shop).
 * A time the clocks skip (spring forward) moves on by the gap — 02:30 on a 2 → 3 o'clock night is
 * 03:30 —, and a time that happens twice (fall back) is the earlier one: what a person at the
 * counter means. Returns null for text that is not such a value.
 */
export function fromShopLocal(value: string, timeZone: string): Date | null {
  const m = LOCAL.exec(value);
  if (!m) return null;
  const [, y, mo, d, h, mi, s] = m.map(Number) as number[];
  const wall = {
    year: y!,
    month: mo!,
    day: d!,
    hour: h!,
    minute: mi!,
    second: Number.isNaN(s) ? 0 : s!,
  };
  const asUtc = wallAsUtc(wall);
  if (
    Number.isNaN(asUtc) ||
    addDays(dayText(wall), 0) !== dayText(wall) ||
    wall.hour > 23 ||
    wall.minute > 59
  )
    return null;
  // Any offset change lies within a day either side; try the offsets before and after it.
  const before = asUtc - offsetAt(asUtc - 86_400_000, timeZone);
  const after = asUtc - offsetAt(asUtc + 86_400_000, timeZone);
  const fits = [before, after]
    .filter((t) => wallAsUtc(wallClock(t, timeZone)) === asUtc)
    .sort((a, b) => a - b);
  return new Date(fits[0] ?? before);
}

/** The `datetime-local` value ('YYYY-MM-DDTHH:mm') showing an instant on the shop's wall clock. */
export function toShopLocal(when: When, timeZone: string): string {
  const w = wallClock(toDate(when).getTime(), timeZone);
  return `${dayText(w)}T${pad(w.hour)}:${pad(w.minute)}`;
}

/** The instant a shop day begins (its midnight, or the first minute after a skipped midnight). */
export function startOfShopDay(day: string, timeZone: string): Date {
  return fromShopLocal(`${day}T00:00`, timeZone)!;
}

export type ShopClock = { timeZone: string; now: Date };

/**
 * The board's due windows on the shop's calendar, as instants for SQL: `today` is the shop's whole
 * day; `week` is from now to the end of the seventh shop day after today ("next 7 days").
 */
export function dueWindows({ timeZone, now }: ShopClock) {
  const today = shopDay(now, timeZone);
  return {
    today: {
      from: startOfShopDay(today, timeZone),
      to: startOfShopDay(addDays(today, 1), timeZone),
    },
    week: { from: now, to: startOfShopDay(addDays(today, 8), timeZone) },
  };
}

export type DueStatus = 'overdue' | 'today' | 'later';

/** How a due time reads at the shop right now: past it, later today, or another day. */
export function dueStatus(dueAt: When, { timeZone, now }: ShopClock): DueStatus {
  const due = toDate(dueAt);
  if (due.getTime() < now.getTime()) return 'overdue';
  return shopDay(due, timeZone) === shopDay(now, timeZone) ? 'today' : 'later';
}

/** A calendar date (e.g. a calibration due date) against the shop's today. */
export function dayStatus(day: string, { timeZone, now }: ShopClock): DueStatus {
  const today = shopDay(now, timeZone);
  return day < today ? 'overdue' : day === today ? 'today' : 'later';
}

/** A calendar date ('YYYY-MM-DD', no instant behind it) for a person: "Mar 8, 2026". */
export function formatShopDay(day: string): string {
  return formatShopTime(`${day}T12:00:00Z`, 'UTC', 'date');
}
