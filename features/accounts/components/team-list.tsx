import Link from 'next/link';
import type { ReactNode } from 'react';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { ROLE_LABELS } from '@/server/auth/permissions';
import type { PendingInvite } from '../server/invites';
import type { TeamMember } from '../server/team';
import { RevokeInviteButton } from './revoke-invite-button';

/** `standing`: a line per member from elsewhere (an apprentice's clearance), handed in by the page. */
export function TeamList({
  members,
  invites,
  standing = {},
}: {
  members: TeamMember[];
  invites: PendingInvite[];
  standing?: Record<string, ReactNode>;
}) {
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="mb-3 text-xl font-bold">
          Members ({members.length})
        </h2>
        <ul className="divide-paper-line border-paper-line divide-y-2 rounded-xl border-2">
          {members.map((m) => (
            <li key={m.id}>
              <Link
                href={`/team/${m.id}`}
                className="min-h-touch hover:bg-paper-dim flex flex-wrap items-center justify-between gap-2 p-3"
              >
                <span>
                  <span className="block font-semibold">{m.name}</span>
                  <span className="text-ink-soft block break-all">{m.email}</span>
                  <span className="text-ink-soft block text-sm">
                    Joined <ShopTime when={m.joinedAt} style="date" />
                  </span>
                  {standing[m.id] ? <span className="block text-sm">{standing[m.id]}</span> : null}
                </span>
                <span className="border-ink rounded-full border-2 px-3 py-0.5 text-sm font-semibold">
                  {ROLE_LABELS[m.role]}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="invites-heading">
        <h2 id="invites-heading" className="mb-3 text-xl font-bold">
          Pending invites ({invites.length})
        </h2>
        {invites.length === 0 ? (
          <p className="text-ink-soft">
            No invites waiting. Invite a technician or apprentice below.
          </p>
        ) : (
          <ul className="divide-paper-line border-paper-line divide-y-2 rounded-xl border-2">
            {invites.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 p-3">
                <span>
                  <span className="font-semibold">{i.email}</span> — {ROLE_LABELS[i.role]}, expires{' '}
                  <ShopTime when={i.expiresAt} />
                </span>
                <RevokeInviteButton inviteId={i.id} email={i.email} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
