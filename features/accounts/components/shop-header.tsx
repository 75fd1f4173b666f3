import type { ReactNode } from 'react';
import { NavLink } from '@/features/ui/nav-link';
import { can, ROLE_LABELS } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { signOut } from '../actions/sign-out';

const linkClass =
  'inline-flex min-h-touch items-center rounded-lg px-3 font-semibold hover:bg-work-dark';

/** Top bar for every shop page; it shows only the places this member can use. `signoff`: the lead's live sign-off link, made where features meet. */
export function ShopHeader({
  member,
  shopName,
  mailbox,
  signoff,
}: {
  member: Member;
  shopName: string;
  mailbox: boolean;
  signoff?: ReactNode;
}) {
  return (
    <header className="bg-work text-white">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-2 px-3 py-2">
        <p className="font-black tracking-tight">
          Ringpass <span className="font-semibold opacity-90">· {shopName}</span>
        </p>
        <nav aria-label="Main" className="flex flex-wrap items-center gap-1">
          {can(member, 'jobs.run') ? <NavLink href="/my-wheels">My wheels</NavLink> : null}
          {/* An apprentice has nothing to do on the board (a cleared one finds their wheels under My wheels). */}
          {can(member, 'jobs.view') ? <NavLink href="/board">Board</NavLink> : null}
          {can(member, 'practice.run') ? <NavLink href="/practice">Practice</NavLink> : null}
          {signoff}
          {can(member.role, 'jobs.create') ? <NavLink href="/customers">Customers</NavLink> : null}
          <NavLink href="/specs">Specs</NavLink>
          {can(member.role, 'verifications.record') ? (
            <NavLink href="/tool-crib">Tool crib</NavLink>
          ) : null}
          {can(member.role, 'team.manage') ? <NavLink href="/team">Team</NavLink> : null}
          {can(member.role, 'shop.settings') ? <NavLink href="/settings">Settings</NavLink> : null}
          {mailbox ? <NavLink href="/mailbox">Mailbox</NavLink> : null}
          <form action={signOut}>
            <button type="submit" className={`${linkClass} border-2 border-white`}>
              Sign out
            </button>
          </form>
        </nav>
      </div>
      <p className="mx-auto max-w-5xl px-3 pb-2 text-sm">
        Signed in as {member.name} ({ROLE_LABELS[member.role]})
      </p>
    </header>
  );
}
