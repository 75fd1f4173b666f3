import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PublicReport } from '@/features/reports/components/public-report';
import { tokenParams } from '@/features/reports/schemas';
import { getPublicReport } from '@/features/reports/server/public-report';

// The token is the only key: never indexed, never sent on to another site in a Referer.
export const metadata: Metadata = {
  title: 'Completion report',
  robots: { index: false, follow: false, nocache: true },
  referrer: 'no-referrer',
};

export default async function CustomerReportPage({ params }: PageProps<'/r/[token]'>) {
  const parsed = tokenParams.safeParse(await params);
  if (!parsed.success) notFound();
  const view = await getPublicReport(parsed.data.token);
  if (!view) notFound();
  return <PublicReport view={view} base={`/r/${parsed.data.token}`} />;
}
