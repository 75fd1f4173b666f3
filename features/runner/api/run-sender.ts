'use client';

import { MutationObserver, onlineManager, QueryClient, QueryObserver } from '@tanstack/react-query';
import type { ClientEvent } from '../events';
import { wheelEventsQueryOptions } from './get-wheel-events';
import { retryDelay } from './send-outcome';

/** What the outbox (use-run-queue) hands the sender: how to send once, and what to do with it. */
export type SenderWork<Sent> = {
  mutationKey: readonly unknown[];
  /** One attempt: takes the written head of the queue and sends it; throws to be retried. */
  attempt: () => Promise<Sent>;
  /** Settles the queue on the answer, before the send counts as done. */
  settle: (sent: Sent) => Promise<void>;
  /** Whether a failed send is tried again (the runner is still open). */
  keepTrying: () => boolean;
  /** Where the server's events for this wheel (every phone's) are read from. */
  eventsUrl: string;
  onRemote: (events: ClientEvent[]) => void;
};

/**
 * The runner's network, loaded after the first paint (use-run-queue imports this module then):
 * TanStack Query's mutation sends the outbox (paused offline, resumed on reconnect, retried 2 s
 * doubling to 30 s) and its query pulls other phones' events every 5 s. Plain observers on a
 * client of its own, so neither Query's React bindings nor a provider are in the page's first load.
 */
export function startSender<Sent>(work: SenderWork<Sent>) {
  followBrowserOnline();
  const client = new QueryClient({ defaultOptions: { queries: { staleTime: 2_000 } } });
  // What QueryClientProvider did: resume paused sends on reconnect, refetch on focus.
  client.mount();
  const sender = new MutationObserver<Sent, Error>(client, {
    mutationKey: work.mutationKey,
    networkMode: 'online',
    retry: () => work.keepTrying(),
    retryDelay,
    mutationFn: work.attempt,
    onSuccess: work.settle,
  });
  const poll = new QueryObserver(client, wheelEventsQueryOptions(work.eventsUrl));
  const stopPolling = poll.subscribe(({ data }) => {
    if (data) work.onRemote(data);
  });
  return {
    send: () => sender.mutate(),
    stop: () => {
      stopPolling();
      sender.reset();
      client.unmount();
    },
  };
}

export type Sender = ReturnType<typeof startSender>;

/**
 * Points Query's onlineManager at the browser. Query assumes "online" until the browser fires an
 * `offline` event, but a runner page reloaded offline (from the service worker's copy) gets no such
 * event: ask the browser at the start too, so a send pauses instead of failing.
 */
function followBrowserOnline() {
  onlineManager.setEventListener((setOnline) => {
    const update = () => setOnline(navigator.onLine);
    update();
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  });
}
