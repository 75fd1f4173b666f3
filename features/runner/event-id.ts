/**
 * The id a phone gives each runner event: a UUIDv7 (RFC 9562 §5.7), whose first 48 bits are the
 * Unix time in milliseconds. The server keeps events by this id (the primary key of
 * wheel_run_events and practice_events), so ids that grow with time land in the index's newest
 * page instead of a random one: with millions of rows a random (v4) id reads and dirties a leaf
 * page that is rarely in memory on every insert. The 74 other bits stay random (Web Crypto), so ids
 * from different phones in the same millisecond practically never meet (a replay of an id
 * stored for another wheel is refused, never merged). Old phones' queued v4 ids are
 * still accepted: the event schema takes any RFC 9562 UUID.
 */

const hex = (bytes: Uint8Array) =>
  Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');

/** A new event id; `now` and `random` are for tests (defaults: the clock and Web Crypto). */
export function newEventId(
  now: number = Date.now(),
  random: (bytes: Uint8Array) => Uint8Array = (b) => crypto.getRandomValues(b),
): string {
  const b = random(new Uint8Array(16));
  // unix_ts_ms, big-endian in octets 0–5 (48 bits: good until the year 10889).
  let ms = Math.max(0, Math.floor(now));
  for (let i = 5; i >= 0; i--) {
    b[i] = ms % 256;
    ms = Math.floor(ms / 256);
  }
  b[6] = 0x70 | (b[6]! & 0x0f); // version 7 in the high nibble of octet 6
  b[8] = 0x80 | (b[8]! & 0x3f); // variant 10 in the two high bits of octet 8
  const h = hex(b);
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
