import type { Metadata } from 'next';
import Link from 'next/link';
import { MyWheels } from '@/features/jobs/components/my-wheels';
import { listMyWheels } from '@/features/jobs/server/my-wheels';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'My wheels' };

export default async function MyWheelsPage() {
  const member = await requireMember('jobs.run', '/my-wheels');
  return (
    <>
      <PageHeader title="My wheels">
        <Link
          href="/board"
          className="min-h-touch text-work inline-flex items-center font-semibold underline"
        >
          Board and search
        </Link>
      </PageHeader>
      <MyWheels wheels={await listMyWheels(member)} />
    </>
  );
}
