'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { newEventId } from '../event-id';
import type { ClientEvent, RunEvent } from '../events';
import { afterPaint } from './after-paint';
import { deviceId } from './device-id';
import { useOnline } from './online';
import {
  outboxKey,
  readOutbox,
  writeOutbox,
  type AttentionItem,
  type OthersWaiting,
  type QueuePerson,
} from './outbox-store';
import type { Sender, startSender } from './run-sender';
import { KeptForRetry, keepsAndRetries, refusalMessage, type SaveEvents } from './send-outcome';

export { outboxKey, othersWaiting } from './outbox-store';
export type { AttentionItem, OthersWaiting, QueuePerson } from './outbox-store';
export { refusalMessage } from './send-outcome';
export type { SaveEvents } from './send-outcome';

// `ready` stays false until this phone's own queue is read: before that "saved" would be a guess.
// `signedOut`: the session ended; what waits is kept and goes once the person signs in again.
type Status = { waiting: number; error: string | null; ready: boolean; signedOut: boolean };
const SENDER_RELOAD_MS = 5_000;
/** One send: the batch taken from the head of the queue and the server's answer (null: nothing sent). */
type Sent = { batch: ClientEvent[]; result: Awaited<ReturnType<SaveEvents>> } | null;

/**
 * The runner's durable outbox. Every confirmation becomes an event with its own id, is applied at
 * once, written to IndexedDB before any network, and leaves "waiting" only on the server's answer.
 * Sending is a Query mutation: it pauses offline, resumes on reconnect and retries with backoff.
 * The sender (./run-sender, TanStack Query) is loaded after the first paint, to keep it out of the
 * runner's first load: taps before it arrives are shown and written to the phone, and wait there.
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
  const key = outboxKey(person.id, wheelId);
  const online = useOnline();
  // Refs mirror the state for the send, which reads the queue as it is when it runs.
  const pendingRef = useRef<ClientEvent[]>([]);
  const savedRef = useRef<ClientEvent[]>(serverEvents);
  const attentionRef = useRef<AttentionItem[]>([]);
  const loaded = useRef(false); // status.ready, readable inside callbacks without re-creating them
  const loadedKey = useRef<string | null>(null); // whose queue `pendingRef` holds once loaded
  const sending = useRef(false); // one send at a time keeps the queue's order
  const again = useRef(false); // asked to send during a send: look once more when it ends
  // Which sender's send `sending` waits for: a stopped sender's paused send never ends, so its
  // late end (if any) must not clear the flag of the send that replaced it.
  const sendRound = useRef(0);
  // The ids of the queue as IndexedDB last committed it. The send takes only these: the screen
  // shows a tap at once, but no event reaches the network before it is on the phone.
  const written = useRef<Set<string>>(new Set());
  const writes = useRef({ started: 0, committed: 0 }); // a slower older write never wins
  const mounted = useRef(true);
  const flushRef = useRef<() => void>(() => {});
  const sender = useRef<Sender | null>(null); // null until ./run-sender has loaded
  useEffect(() => {
    mounted.current = true;
    return () => {
      mounted.current = false;
    };
  }, []);

  // The device keeps both what waits and what the server already has, so a reload while offline
  // (the page then comes from the service worker's copy) still shows every confirmation.
  const persist = useCallback(async () => {
    const pendingNow = pendingRef.current;
    const order = ++writes.current.started;
    await writeOutbox(key, {
      owner: person,
      pending: pendingNow,
      saved: savedRef.current,
      attention: attentionRef.current,
      generation,
    });
    if (order < writes.current.committed) return;
    writes.current.committed = order;
    written.current = new Set(pendingNow.map((e) => e.clientId));
  }, [key, person, generation]);

  /** Sets events aside for good: out of the queue, into "Needs attention" with the reason. */
  const setAside = useCallback((items: AttentionItem[]) => {
    if (!items.length) return;
    attentionRef.current = [...attentionRef.current, ...items];
    setAttention(attentionRef.current);
  }, []);

  /** The queue on screen now; `persist` puts it on the phone. */
  const show = useCallback((next: ClientEvent[]) => {
    pendingRef.current = next;
    setPending(next);
    setStatus((s) => ({ ...s, waiting: next.length }));
  }, []);
  const store = useCallback(
    async (next: ClientEvent[]) => {
      show(next);
      await persist();
    },
    [show, persist],
  );

  /** Adds the server's events to the saved copy; says whether any were new. */
  const addSaved = useCallback((more: ClientEvent[]) => {
    const ids = new Set(savedRef.current.map((e) => e.clientId));
    const fresh = more.filter((e) => !ids.has(e.clientId));
    if (!fresh.length) return false;
    savedRef.current = [...savedRef.current, ...fresh];
    setSaved(savedRef.current);
    return true;
  }, []);

  // One send, as the sender's Query mutation runs it. Offline it waits (paused) and goes on
  // reconnect; every failure that may pass is retried, 2 s doubling to 30 s, for as long as the
  // runner is open: the events are on the phone, so waiting costs nothing.
  const attempt = useCallback(async (): Promise<Sent> => {
    // Each attempt takes the head of the queue as it is now, so a retry carries what was added,
    // but only what IndexedDB already holds: a tap whose write is under way waits for the next.
    const batch = pendingRef.current.filter((e) => written.current.has(e.clientId)).slice(0, 100);
    if (!batch.length || !mounted.current) return null;
    let result: Awaited<ReturnType<SaveEvents>>;
    try {
      result = await saveEvents(null, { wheelId, events: batch });
    } catch (error) {
      // Kept and retried with the server's reason on screen (e.g. an Origin it refused).
      if (error instanceof KeptForRetry) setStatus((s) => ({ ...s, error: error.message }));
      throw error;
    }
    if (!result.ok && keepsAndRetries(result.code)) {
      const signedOut = result.code === 'unauthenticated';
      setStatus((s) => ({
        ...s,
        signedOut,
        error: signedOut
          ? 'Your session has ended. Everything waiting stays on this phone.'
          : result.message,
      }));
      throw new KeptForRetry(result.message, signedOut);
    }
    return { batch, result };
  }, [saveEvents, wheelId]);
  // Settled before the send counts as done, so the queue on the phone never lags the answer.
  const settle = useCallback(
    async (sent: Sent) => {
      // A late answer after the runner closed: this copy's queue is stale, and writing it would
      // replace what a newer runner on this wheel keeps. The events stay queued; the server
      // stores each id once, so the next runner's resend is answered as duplicates.
      if (!sent || !mounted.current) return;
      const { batch, result } = sent;
      const sentIds = new Set(batch.map((e) => e.clientId));
      if (result.ok) {
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
        await store(pendingRef.current.filter((e) => !sentIds.has(e.clientId)));
        setStatus((s) => ({ ...s, error: refusalMessage(refusals), signedOut: false }));
      } else {
        // The server refused these for good (bad data, no permission): keep them out of the queue
        // so the rest can go, list them under "Needs attention", and say so.
        setAside(batch.map((event) => ({ event, reason: result.message })));
        await store(pendingRef.current.filter((e) => !sentIds.has(e.clientId)));
        setStatus((s) => ({ ...s, error: result.message }));
      }
    },
    [setAside, addSaved, store],
  );
  // The sender outlives renders; it reaches the latest of these through the ref.
  const work = useRef({ attempt, settle });
  useEffect(() => {
    work.current = { attempt, settle };
  }, [attempt, settle]);

  /** Sends the head of the queue unless a send is under way; then the next batch, until empty. */
  const flush = useCallback(() => {
    // Before the sender has loaded, what waits is on the phone: its arrival flushes.
    const send = sender.current?.send;
    if (!loaded.current || !pendingRef.current.length || !send) return;
    if (sending.current) {
      again.current = true; // e.g. a write committed after this send took its batch
      return;
    }
    sending.current = true;
    again.current = false;
    const round = sendRound.current;
    void send()
      .then((sent) => sent !== null)
      .catch(() => false) // given up only when the runner closed; the phone keeps the events
      .then((more) => {
        if (round !== sendRound.current) return; // its sender was stopped; a new one took over
        sending.current = false;
        const next = more || again.current;
        again.current = false;
        if (next && mounted.current) flushRef.current();
      });
  }, []);
  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  // Load what this device still holds from before a reload (online or offline).
  useEffect(() => {
    let cancelled = false;
    void (async () => {
      const { held, others: theirs } = await readOutbox(person, wheelId);
      if (cancelled) return;
      setOthers(theirs);
      // Taps made on this wheel while its queue was being read are only on screen (`record` does
      // not write before the read: it would replace what waits on the phone). They join what the
      // phone held, after it, and the whole queue is written once.
      const early =
        loadedKey.current === null || loadedKey.current === key ? pendingRef.current : [];
      loaded.current = true;
      loadedKey.current = key;
      attentionRef.current = held?.attention ?? [];
      setAttention(attentionRef.current);
      // A send-back since this copy was kept: the events it superseded are not this phone's to show.
      if ((held?.generation ?? null) === generation) addSaved(held?.saved ?? []);
      const known = new Set(savedRef.current.map((e) => e.clientId));
      const heldPending = (held?.pending ?? []).filter((e) => !known.has(e.clientId));
      heldPending.forEach((e) => known.add(e.clientId));
      await store([...heldPending, ...early.filter((e) => !known.has(e.clientId))]);
      setStatus((s) => ({ ...s, ready: true }));
      flush();
    })();
    return () => {
      cancelled = true;
    };
  }, [wheelId, person, generation, key, store, flush, addSaved]);

  // The sender, once this phone's queue is read and the screen painted: it sends what waits and
  // pulls other phones' events on this wheel every few seconds (both paused offline).
  const ready = status.ready;
  useEffect(() => {
    if (!ready) return;
    let stopped = false;
    let started: Sender | null = null;
    // A counter, not a node: the cleanup bumps whatever round is current then.
    const rounds = sendRound;
    // A failed load (the network dropped before the service worker kept the file) is tried again.
    const load = (): Promise<{ startSender: typeof startSender } | null> =>
      stopped
        ? Promise.resolve(null)
        : import('./run-sender').catch(() =>
            new Promise((again) => setTimeout(again, SENDER_RELOAD_MS)).then(load),
          );
    void afterPaint()
      .then(load)
      .then((module) => {
        if (!module || stopped) return;
        started = module.startSender<Sent>({
          mutationKey: ['runner', 'outbox', key],
          attempt: () => work.current.attempt(),
          settle: (sent) => work.current.settle(sent),
          keepTrying: () => mounted.current,
          eventsUrl,
          onRemote: (remote) => {
            if (addSaved(remote)) void persist();
          },
        });
        sender.current = started;
        flushRef.current();
      });
    return () => {
      stopped = true;
      started?.stop();
      if (sender.current === started) sender.current = null;
      // A send the stopped sender held (paused offline) never ends: free the queue for the next
      // sender, which takes the same events again (the server stores each id once).
      rounds.current++;
      sending.current = false;
      again.current = false;
    };
  }, [ready, key, eventsUrl, addSaved, persist]);

  const record = useCallback(
    async (event: RunEvent) => {
      // `deviceId`: which phone confirmed it, for the lead's review (a shared phone and a second phone both show).
      const now = Date.now(); // one reading: the id's time and the event's time are the same moment
      const full = {
        ...event,
        // Time-ordered, so the server's event index takes it in its newest page (event-id.ts).
        clientId: newEventId(now),
        clientAt: new Date(now).toISOString(),
        deviceId: deviceId(),
      } as ClientEvent;
      show([...pendingRef.current, full]);
      // The tap is drawn first: the write (IndexedDB clones the whole outbox) waits until that
      // frame is painted. The send still waits for the write (it takes only what is written).
      await afterPaint();
      // Before the phone's queue is read, a write would replace what waits there: the load adds
      // this tap to what it finds and writes both.
      if (!loaded.current) return;
      await persist();
      flush();
    },
    [show, persist, flush],
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
