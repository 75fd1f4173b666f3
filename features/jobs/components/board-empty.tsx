import Link from 'next/link';
import { EmptyState } from '@/features/ui/page';

export function BoardEmpty({ canManageTeam }: { canManageTeam: boolean }) {
  return (
    <EmptyState title="No job cards yet">
      <p>Job cards for the shop&apos;s wheels will appear here as soon as they are created.</p>
      {canManageTeam ? (
        <p className="mt-2">
          Meanwhile,{' '}
          <Link href="/team" className="font-semibold text-work underline">
            invite your technicians and apprentices
          </Link>
          .
        </p>
      ) : null}
    </EmptyState>
  );
}
