import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { JobFollowUp } from '@/features/follow-up/components/job-follow-up';
import { JobCardPrint } from '@/features/jobs/components/job-card-print';
import { JobDetails } from '@/features/jobs/components/job-details';
import { JobEditForm } from '@/features/jobs/components/job-edit-form';
import { TransitionForm } from '@/features/jobs/components/transition-form';
import { ids } from '@/features/jobs/schemas';
import { getPrintedWheels } from '@/features/jobs/server/job-card-print';
import { getJob, listAssignees } from '@/features/jobs/server/jobs';
import { getWorkFacts } from '@/features/jobs/server/work-facts';
import { allowedTransitions, isSelfReview } from '@/features/jobs/transitions';
import { listJobPhotos } from '@/features/runner/server/photo-router';
import { buttonClass } from '@/features/ui/button';
import { PageHeader } from '@/features/ui/page';
import { PrintButton } from '@/features/ui/print-button';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { orNotFound } from '@/server/errors';
import { ReportPanel } from './_components/report-panel';

export const metadata: Metadata = { title: 'Job card' };

export default async function JobPage({ params }: PageProps<'/jobs/[jobId]'>) {
  const member = await requireMember('jobs.view');
  const id = ids.job.safeParse((await params).jobId);
  if (!id.success) notFound();
  const job = await orNotFound(getJob(member.shopId, id.data));
  const editable = can(member.role, 'jobs.edit') && job.state !== 'signed_off';
  const [photos, facts, printedWheels, assignees] = await Promise.all([
    listJobPhotos(member.shopId, job.id),
    getWorkFacts(member.shopId, job.id),
    getPrintedWheels(member.shopId, job.id),
    editable ? listAssignees(member.shopId) : [],
  ]);
  // An apprentice whose clearance was revoked (or someone who left) still holds the card: the
  // runner refuses them, so the lead is told to hand it on rather than finding out at the wheel.
  const heldByUnassignable =
    editable && job.assignee && !assignees.some((a) => a.id === job.assignee?.id)
      ? job.assignee.name
      : null;
  return (
    <>
      <Link href="/board" className="text-work font-semibold underline">
        ← Board
      </Link>
      <PageHeader title={`Job #${job.number} · ${job.vehicle.label}`}>
        <div className="flex flex-wrap gap-2">
          <PrintButton>Print job card</PrintButton>
          {can(member.role, 'jobs.signoff') && job.state !== 'open' ? (
            <Link
              href={`/jobs/${job.id}/review`}
              className={buttonClass(job.state === 'awaiting_signoff' ? 'primary' : 'secondary')}
            >
              {job.state === 'awaiting_signoff' ? 'Review for sign-off' : 'Review the record'}
            </Link>
          ) : null}
        </div>
      </PageHeader>
      <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
        <JobDetails
          job={job}
          photos={photos}
          canRun={
            can(member.role, 'jobs.run') &&
            (member.role === 'lead' || job.assignee?.id === member.userId)
          }
        />
        <div className="flex flex-col gap-6">
          <TransitionForm
            jobId={job.id}
            allowed={
              allowedTransitions(member, job, facts).filter(
                (t) => t !== 'sign_off',
              ) /* signed off from the review */
            }
            selfReview={isSelfReview(member, job, 'sign_off', facts)}
          />
          <ReportPanel member={member} jobId={job.id} state={job.state} />
          {job.state === 'signed_off' ? (
            <JobFollowUp
              shopId={member.shopId}
              jobId={job.id}
              canManage={can(member.role, 'followup.manage')}
            />
          ) : null}
          {heldByUnassignable ? (
            <p
              role="note"
              className="border-caution bg-caution-tint text-caution-ink rounded-lg border-2 p-3 font-semibold"
            >
              {heldByUnassignable} can no longer run real wheels (not cleared for real wheels, or no
              longer on the team): the runner refuses them. Assign this job card to someone else.
            </p>
          ) : null}
          {editable ? <JobEditForm job={job} assignees={assignees} /> : null}
        </div>
      </div>
      <JobCardPrint job={job} wheels={printedWheels} />
    </>
  );
}
