import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { reviewSources } from '@/app/_review/sources';
import { ids } from '@/features/jobs/schemas';
import { getJob } from '@/features/jobs/server/jobs';
import { getWorkFacts } from '@/features/jobs/server/work-facts';
import { isSelfReview, transitionRefusal } from '@/features/jobs/transitions';
import { blocking } from '@/features/review/anomalies';
import { AcknowledgementList } from '@/features/review/components/acknowledgement-list';
import { AnomalyList } from '@/features/review/components/anomaly-list';
import { DecidePanel } from '@/features/review/components/decide-panel';
import { LatestDecision } from '@/features/review/components/latest-decision';
import { WheelReview } from '@/features/review/components/wheel-review';
import { listAcknowledgements } from '@/features/review/server/decide';
import { getJobReview } from '@/features/review/server/review-data';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { orNotFound } from '@/server/errors';
import { approveReviewed, sendBackReviewed } from './actions';

export const metadata: Metadata = { title: 'Review' };

export default async function ReviewPage({ params }: PageProps<'/jobs/[jobId]/review'>) {
  const p = await params;
  const member = await requireMember('jobs.signoff', `/jobs/${p.jobId}/review`);
  const id = ids.job.safeParse(p.jobId);
  if (!id.success) notFound();
  const review = await orNotFound(getJobReview(member.shopId, id.data, reviewSources));
  const [job, facts, acknowledgements] = await Promise.all([
    getJob(member.shopId, id.data),
    getWorkFacts(member.shopId, id.data),
    listAcknowledgements(member.shopId, id.data),
  ]);
  const refusal = transitionRefusal(member, job, 'sign_off', facts)?.message ?? null;
  const steps = reviewSources.stepsFor(review.job).filter((s) => s.id !== 'submit');
  return (
    <>
      <Link href={`/jobs/${review.job.id}`} className="text-work font-semibold underline">
        ← Job card
      </Link>
      <PageHeader title={`Review · Job #${review.job.number} · ${review.job.vehicleLabel}`} />
      <p className="text-ink-soft -mt-4 mb-4">
        {review.job.customerName} · assigned to {review.job.assignee?.name ?? 'nobody'}
        {review.job.vin ? ` · VIN ${review.job.vin}` : ''}
      </p>
      <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
        <div className="flex flex-col gap-6">
          <section aria-labelledby="anomalies">
            <h2 id="anomalies" className="mb-2 text-xl font-bold">
              Anomalies
            </h2>
            <AnomalyList anomalies={review.anomalies} />
          </section>
          {review.wheels.map((w) => (
            <WheelReview key={w.id} wheel={w} people={review.people} />
          ))}
        </div>
        <aside className="flex flex-col gap-6">
          <LatestDecision
            decision={
              job.events.findLast((e) => e.action === 'sign_off' || e.action === 'send_back') ??
              null
            }
          />
          <DecidePanel
            jobId={review.job.id}
            refusal={refusal}
            selfReview={isSelfReview(member, job, 'sign_off', facts)}
            blocking={blocking(review.anomalies).map((a) => ({ key: a.key, message: a.message }))}
            wheels={review.wheels.map((w) => ({ id: w.id, position: w.position }))}
            steps={steps}
            approve={approveReviewed}
            sendBack={sendBackReviewed}
          />
          <AcknowledgementList acknowledgements={acknowledgements} />
        </aside>
      </div>
    </>
  );
}
