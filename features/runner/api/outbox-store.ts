import { get, keys, set } from 'idb-keyval';
import type { ClientEvent } from '../events';

/** The person signed in on this phone; their outbox is theirs alone. */
export type QueuePerson = { id: string; name: string };
/** An event the server refused for good, kept on the phone with the reason until dismissed. */
export type AttentionItem = { event: ClientEvent; reason: string };
/** Another person's events waiting on this phone for this wheel: never sent under this person's name. */
export type OthersWaiting = { ownerName: string; waiting: number };

/**
 * What the phone keeps per person and wheel in IndexedDB, the source of truth for what waits.
 * `generation`: the lead's latest send-back of the wheel (its time), so a phone drops its copy of
 * events the send-back superseded.
 */
export type Held = {
  owner: QueuePerson;
  pending: ClientEvent[];
  saved: ClientEvent[];
  attention: AttentionItem[];
  generation: string | null;
};

const PREFIX = 'ringpass:run:';
/** The outbox key: person and wheel, so one person's waiting events are never sent in another's session. */
export const outboxKey = (personId: string, wheelId: string) => `${PREFIX}${personId}:${wheelId}`;

/** Other people's waiting events for this wheel, from the phone's stored outboxes (pure, for the screen and tests). */
export function othersWaiting(
  entries: readonly [string, unknown][],
  person: QueuePerson,
  wheelId: string,
): OthersWaiting[] {
  return entries.flatMap(([k, value]) => {
    if (k === outboxKey(person.id, wheelId)) return [];
    const legacy = k === `${PREFIX}${wheelId}`;
    if (!legacy && !(k.startsWith(PREFIX) && k.endsWith(`:${wheelId}`))) return [];
    const held = value as Partial<Held> | undefined;
    const waiting = held?.pending?.length ?? 0;
    // Stored before outboxes were kept per person: whose they are is unknown, so they are not sent.
    return waiting
      ? [{ ownerName: held?.owner?.name ?? 'someone (from before an update)', waiting }]
      : [];
  });
}

/** This person's outbox for the wheel (if the phone holds one) and everyone else's waiting counts. */
export async function readOutbox(
  person: QueuePerson,
  wheelId: string,
): Promise<{ held: Held | undefined; others: OthersWaiting[] }> {
  const held = await get<Held>(outboxKey(person.id, wheelId));
  const all = await keys().then((ks) =>
    Promise.all(
      ks
        .map(String)
        .filter((k) => k.startsWith(PREFIX) && k.endsWith(wheelId))
        .map(async (k) => [k, await get(k)] as [string, unknown]),
    ),
  );
  return { held, others: othersWaiting(all, person, wheelId) };
}

/** Replaces this person's outbox for the wheel; resolves once IndexedDB has committed it. */
export const writeOutbox = (key: string, held: Held) => set(key, held);
