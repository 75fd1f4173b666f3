'use client';

import { get, keys, set } from 'idb-keyval';
import { useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import { unstable_isUnrecognizedActionError } from 'next/navigation';
import type { ActionResult, FailureCode } from '@/server/action';
import type { ClientEvent, EventRefusal, RunEvent } from '../events';
import { deviceId } from './device-id';

// `ready` stays false until this phone's own queue is read: before that "saved" would be a guess.
// `signedOut`: the session ended; what waits is kept and goes once the person signs in again.
type Status = { waiting: number; error: string | null; ready: boolean; signedOut: boolean };

/** The person signed in on this phone; their outbox is theirs alone. */
export type QueuePerson = { id: string; name: string };
/** An event the server refused for good, kept on the phone with the reason until dismissed. */
export type AttentionItem = { event: ClientEvent; reason: string };
/** Another person's events waiting on this phone for this wheel: never sent under this person's name. */
export type OthersWaiting = { ownerName: string; waiting: number };

/**
 * What the phone keeps per person and wheel. `generation`: the lead's latest send-back of the
 * wheel (its time), so a phone drops its copy of events the send-back superseded.
 */
type Held = {
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

function subscribeOnline(change: () => void) {
  window.addEventListener('online', change);
  window.addEventListener('offline', change);
  return () => {
    window.removeEventListener('online', change);
    window.removeEventListener('offline', change);
  };
}

/** The server action that stores a batch (passed down from the runner page). */
export type SaveEvents = (
  prev: unknown,
  input: { wheelId: string; events: ClientEvent[] },
) => Promise<ActionResult<{ saved: number; duplicates: number; refused?: EventRefusal[] }>>;

// Refusals that may pass: a session that ended (sign in again), a rate limit, our own failure.
const KEEP_AND_RETRY = new Set<FailureCode>(['unauthenticated', 'rate_limited', 'internal']);

/** What the technician reads when the server set some confirmations aside. */
export function refusalMessage(refused: EventRefusal[]): string | null {
  if (refused.length === 0) return null;
  const what =
    refused.length === 1 ? 'One confirmation was' : `${refused.length} confirmations were`;
  return `${what} not saved and set aside: ${refused[0]!.message} Everything else was saved; redo that step if it still needs doing.`;
}

const RELOADED_AT = 'ringpass:reloaded-for-new-build';
function reloadForNewBuild(): boolean {
  const last = Number(sessionStorage.getItem(RELOADED_AT) ?? 0);
  if (Date.now() - last < 60_000) return false;
  sessionStorage.setItem(RELOADED_AT, String(Date.now()));
  location.reload();
  return true;
}

/**
 * The runner's durable outbox. Every confirmation becomes an event with its own id, is applied at
 * once, kept in IndexedDB until the server has it, and sent in order when the network allows.
 * The server stores each id once, so sending again after a drop or a reload is always safe.
 */
export function useRunQueue(
  wheelId: string,
  serverEvents: ClientEvent[],
  saveEvents: SaveEvents,
  person: QueuePerson,
  generation: string | null = null,
  /** Where the stored events are pulled from: the wheel's, or a practice attempt's. */
  eventsUrl = `/api/wheels/${wheelId}/events`,
) {
  const [saved, setSaved] = useState<ClientEvent[]>(serverEvents);
  const [pending, setPending] = useState<ClientEvent[]>([]);
  const [attention, setAttention] = useState<AttentionItem[]>([]);
  const [others, setOthers] = useState<OthersWaiting[]>([]);
  const [status, setStatus] = useState<Status>({
    waiting: 0,
    error: null,
    ready: false,
    signedOut: false,
  });
  const attentionRef = useRef<AttentionItem[]>([]);
  const key = outboxKey(person.id, wheelId);
  const online = useSyncExternalStore(
    subscribeOnline,
    () => navigator.onLine,
    () => true,
  );
  const flushRef = useRef<() => Promise<void>>(async () => {});
  const pendingRef = useRef<ClientEvent[]>([]);
  const loaded = useRef(false); // status.ready, readable inside the send callback without re-creating it
  const sending = useRef(false);
  const retry = useRef<ReturnType<typeof setTimeout> | null>(null);
  const attempt = useRef(0);

  const savedRef = useRef<ClientEvent[]>(serverEvents);
  // The device keeps both what waits and what the server already has, so a reload while offline
  // (the page then comes from the service worker's copy) still shows every confirmation.
  const persist = useCallback(
    () =>
      set(key, {
        owner: person,
        pending: pendingRef.current,
        saved: savedRef.current,
        attention: attentionRef.current,
        generation,
      } satisfies Held),
    [key, person, generation],
  );

  /** Sets events aside for good: out of the queue, into "Needs attention" with the reason. */
  const setAside = useCallback((items: AttentionItem[]) => {
    if (!items.length) return;
    attentionRef.current = [...attentionRef.current, ...items];
    setAttention(attentionRef.current);
  }, []);

  const store = useCallback(
    async (next: ClientEvent[]) => {
      pendingRef.current = next;
      setPending(next);
      setStatus((s) => ({ ...s, waiting: next.length }));
      await persist();
    },
    [persist],
  );

  const addSaved = useCallback((more: ClientEvent[]) => {
    const ids = new Set(savedRef.current.map((e) => e.clientId));
    savedRef.current = [...savedRef.current, ...more.filter((e) => !ids.has(e.clientId))];
    setSaved(savedRef.current);
  }, []);

  const flush = useCallback(async () => {
    if (sending.current || !loaded.current) return;
    const batch = pendingRef.current.slice(0, 100);
    if (batch.length === 0) return;
    if (typeof navigator !== 'undefined' && !navigator.onLine) return;
    sending.current = true;
    const sent = new Set(batch.map((e) => e.clientId));
    const backOff = () => {
      attempt.current += 1;
      const wait = Math.min(30_000, 1000 * 2 ** attempt.current);
      if (retry.current) clearTimeout(retry.current);
      retry.current = setTimeout(() => void flushRef.current(), wait);
    };
    try {
      const result = await saveEvents(null, { wheelId, events: batch });
      if (result.ok) {
        attempt.current = 0;
        // The server judged each event alone: the ones it refused for good leave the queue (with
        // a message), everything else in the batch was stored.
        const refusals = result.data.refused ?? [];
        const refused = new Set(refusals.map((r) => batch[r.index]?.clientId));
        setAside(
          refusals.flatMap((r) =>
            batch[r.index] ? [{ event: batch[r.index]!, reason: r.message }] : [],
          ),
        );
        addSaved(batch.filter((e) => !refused.has(e.clientId)));
        await store(pendingRef.current.filter((e) => !sent.has(e.clientId)));
        setStatus((s) => ({
          ...s,
          error: refusalMessage(result.data.refused ?? []),
          signedOut: false,
        }));
      } else if (KEEP_AND_RETRY.has(result.code)) {
        const signedOut = result.code === 'unauthenticated';
        setStatus((s) => ({
          ...s,
          signedOut,
          error: signedOut
            ? 'Your session has ended. Everything waiting stays on this phone.'
            : result.message,
        }));
        backOff();
      } else {
        // The server refused these for good (bad data, no permission): keep them out of the queue
        // so the rest can go, list them under "Needs attention", and say so.
        setAside(batch.map((event) => ({ event, reason: result.message })));
        await store(pendingRef.current.filter((e) => !sent.has(e.clientId)));
        setStatus((s) => ({ ...s, error: result.message }));
      }
    } catch (error) {
      // A deploy replaced the build this page came from, so its action id is gone: reload into the
      // new build, which sends what waits from IndexedDB. Once a minute at most, then keep retrying.
      if (unstable_isUnrecognizedActionError(error) && reloadForNewBuild()) return;
      backOff();
    } finally {
      sending.current = false;
    }
    if (pendingRef.current.length && attempt.current === 0) void flushRef.current();
  }, [wheelId, store, addSaved, saveEvents, setAside]);
  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  // Load what this device still holds from before a reload (online or offline).
  useEffect(() => {
    let cancelled = false;
    void (async () => {
      const held = await get<Held>(key);
      const all = await keys().then((ks) =>
        Promise.all(
          ks
            .map(String)
            .filter((k) => k.startsWith(PREFIX) && k.endsWith(wheelId))
            .map(async (k) => [k, await get(k)] as [string, unknown]),
        ),
      );
      if (cancelled) return;
      setOthers(othersWaiting(all, person, wheelId));
      loaded.current = true;
      attentionRef.current = held?.attention ?? [];
      setAttention(attentionRef.current);
      // A send-back since this copy was kept: the events it superseded are not this phone's to show.
      if ((held?.generation ?? null) === generation) addSaved(held?.saved ?? []);
      const known = new Set(savedRef.current.map((e) => e.clientId));
      await store((held?.pending ?? []).filter((e) => !known.has(e.clientId)));
      setStatus((s) => ({ ...s, ready: true }));
      void flush();
    })();
    return () => {
      cancelled = true;
    };
  }, [key, wheelId, person, generation, store, flush, addSaved]);

  // Another device on the same wheel: pull the server's events now and then, so both converge.
  useEffect(() => {
    if (!online) return;
    const pull = async () => {
      const res = await fetch(eventsUrl).catch(() => null);
      if (!res?.ok) return;
      const body = (await res.json()) as { data: { events: ClientEvent[] } };
      addSaved(body.data.events);
      await persist();
    };
    const timer = setInterval(() => void pull(), 5_000);
    return () => clearInterval(timer);
  }, [online, eventsUrl, addSaved, persist]);

  // Back online: send what waited, without waiting for the retry timer.
  useEffect(() => {
    if (!online) return;
    attempt.current = 0;
    void flush();
  }, [online, flush]);
  useEffect(
    () => () => {
      if (retry.current) clearTimeout(retry.current);
    },
    [],
  );

  const record = useCallback(
    async (event: RunEvent) => {
      // `deviceId`: which phone confirmed it, for the lead's review (a shared phone and a second phone both show).
      const full = {
        ...event,
        clientId: crypto.randomUUID(),
        clientAt: new Date().toISOString(),
        deviceId: deviceId(),
      } as ClientEvent;
      await store([...pendingRef.current, full]);
      void flush();
    },
    [store, flush],
  );

  const events = useMemo(() => {
    const ids = new Set(saved.map((e) => e.clientId));
    return [...saved, ...pending.filter((e) => !ids.has(e.clientId))];
  }, [saved, pending]);

  const dismiss = useCallback(async () => {
    attentionRef.current = [];
    setAttention([]);
    await persist();
  }, [persist]);

  return { events, record, status: { ...status, online }, attention, others, dismiss };
}
