import type { ReactNode } from 'react';
import { ShopTime } from '@/features/ui/shop-time-zone';
import type { SinkMessage } from '@/server/mail/mailbox';

/** Turns bare links in a plain-text mail into links, so an invite can be followed. */
function linkify(text: string): ReactNode[] {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="text-work font-semibold break-all underline">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

/** The shop's mail from the local sink; `demo` when a production server shows it for a demonstration. */
export function MailboxList({ messages, demo }: { messages: SinkMessage[]; demo: boolean }) {
  return (
    <section className="mx-auto w-full max-w-3xl" aria-labelledby="mailbox-heading">
      <h1 id="mailbox-heading" className="text-2xl font-bold">
        Mailbox
      </h1>
      {demo ? (
        <p className="border-danger bg-danger-tint text-danger mt-2 rounded-lg border-2 p-3 font-semibold">
          Demo server: this Mailbox is switched on (MAILBOX_DEMO) and no mail leaves this machine.
          Never run a shop&apos;s real work on it.
        </p>
      ) : null}
      <p className="border-caution bg-caution-tint text-caution-ink mt-2 mb-6 rounded-lg border-2 p-3">
        Development only: the e-mails the app sent for this shop to the local mail sink, newest
        first. Nothing here was delivered.
      </p>
      {messages.length === 0 ? (
        <p>No e-mail sent yet. Invite someone from the Team page and it shows up here.</p>
      ) : (
        <ol className="flex flex-col gap-4">
          {messages.map((m) => (
            <li key={m.id}>
              <article
                className="border-paper-line rounded-xl border-2 p-4"
                aria-label={`${m.subject} to ${m.to.join(', ')}`}
              >
                <h2 className="text-lg font-bold">{m.subject}</h2>
                <p className="text-ink-soft text-sm">
                  To {m.to.join(', ')} · <ShopTime when={m.receivedAt} />
                </p>
                <p className="mt-3 whitespace-pre-wrap">{linkify(m.text)}</p>
              </article>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
