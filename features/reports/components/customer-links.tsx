'use client';

import { useRef, useState, useTransition } from 'react';
import { buttonClass } from '@/features/ui/button';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { createCustomerLink, revokeCustomerLink } from '../actions/report-link-actions';

export type LinkRow = { id: string; created: string; expires: string };
type CopyState = 'idle' | 'copied' | 'failed';

/** Each link's name for Revoke, by when it was made; two made the same minute also get a number. */
function linkName(link: LinkRow, links: LinkRow[]): string {
  const same = links.filter((o) => o.created === link.created);
  const nth = same.length > 1 ? ` (${same.indexOf(link) + 1} of ${same.length})` : '';
  return `the link made ${link.created}${nth}`;
}

/**
 * A lead's customer links for a signed-off job: the active ones, Revoke (asked first: the customer
 * loses the report), and New customer link, whose URL is shown once (only its hash is kept), for a
 * customer without an e-mail address.
 */
export function CustomerLinks({ jobId, links }: { jobId: string; links: LinkRow[] }) {
  const [pending, start] = useTransition();
  const [fresh, setFresh] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [copy, setCopy] = useState<CopyState>('idle');
  const urlField = useRef<HTMLInputElement>(null);

  const create = () =>
    start(async () => {
      const result = await createCustomerLink(null, { jobId });
      setCopy('idle');
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
  // "Copied" only once the clipboard took it: a lead who believes it and sends nothing leaves the
  // customer without the report (the link is shown only this once).
  const copyLink = async () => {
    if (!fresh) return;
    try {
      await navigator.clipboard.writeText(fresh);
      setCopy('copied');
    } catch {
      setCopy('failed');
      urlField.current?.focus(); // selects it (onFocus), ready to copy by hand
    }
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
              <ConfirmDialog
                triggerLabel="Revoke"
                triggerAriaLabel={`Revoke ${linkName(l, links)}`}
                title="Revoke this customer link?"
                description={`The link made ${l.created} stops opening the report at once. If the customer still needs it, make a new link and give them that.`}
                confirmLabel={`Revoke ${linkName(l, links)}`}
                onConfirm={() => revoke(l.id)}
                disabled={pending}
              />
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
            ref={urlField}
            readOnly
            value={fresh}
            aria-label="Customer link"
            className="w-full rounded border px-2 py-1 font-mono text-sm"
            onFocus={(e) => e.currentTarget.select()}
          />
          <button type="button" onClick={copyLink} className={buttonClass('primary')}>
            {copy === 'copied' ? 'Copied' : 'Copy link'}
          </button>
          {copy === 'failed' ? (
            <p className="text-danger text-sm font-semibold">
              Copy failed — select the link and copy it.
            </p>
          ) : null}
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
