'use client';

import { useState, useTransition } from 'react';
import { buttonClass } from '@/features/ui/button';
import { createCustomerLink, revokeCustomerLink } from '../actions/report-link-actions';

export type LinkRow = { id: string; created: string; expires: string };

/**
 * A lead's customer links for a signed-off job: the active ones, Revoke, and New customer link,
 * whose URL is shown once (only its hash is kept), for a customer without an e-mail address.
 */
export function CustomerLinks({ jobId, links }: { jobId: string; links: LinkRow[] }) {
  const [pending, start] = useTransition();
  const [fresh, setFresh] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);

  const create = () =>
    start(async () => {
      const result = await createCustomerLink(null, { jobId });
      setCopied(false);
      if (result.ok) {
        setFresh(result.data.url);
        setMessage(null);
      } else setMessage(result.message);
    });
  const revoke = (linkId: string) =>
    start(async () => {
      const result = await revokeCustomerLink(null, { linkId });
      setMessage(result.ok ? 'Link revoked: it no longer opens the report.' : result.message);
    });
  const copy = async () => {
    if (!fresh) return;
    await navigator.clipboard.writeText(fresh).catch(() => undefined);
    setCopied(true);
  };

  return (
    <div className="flex flex-col gap-3">
      <h3 className="font-semibold">Customer links</h3>
      {links.length ? (
        <ul className="flex flex-col gap-2 text-sm">
          {links.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center justify-between gap-2">
              <span>
                Made {l.created}, works until {l.expires}
              </span>
              <button
                type="button"
                disabled={pending}
                onClick={() => revoke(l.id)}
                className="text-danger font-semibold underline"
              >
                Revoke
              </button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm">No active customer link.</p>
      )}
      <button
        type="button"
        disabled={pending}
        onClick={create}
        className={buttonClass('secondary')}
      >
        New customer link
      </button>
      {fresh ? (
        <div className="border-ink flex flex-col gap-2 rounded-lg border-2 p-3" role="status">
          <p className="text-sm">Give this to the customer now; it is shown only this once.</p>
          <input
            readOnly
            value={fresh}
            aria-label="Customer link"
            className="w-full rounded border px-2 py-1 font-mono text-sm"
            onFocus={(e) => e.currentTarget.select()}
          />
          <button type="button" onClick={copy} className={buttonClass('primary')}>
            {copied ? 'Copied' : 'Copy link'}
          </button>
        </div>
      ) : null}
      {message ? (
        <p className="text-sm" role="status">
          {message}
        </p>
      ) : null}
    </div>
  );
}
