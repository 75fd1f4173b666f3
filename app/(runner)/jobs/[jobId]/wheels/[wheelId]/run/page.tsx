import type { Metadata } from 'next';
import { forbidden, notFound } from 'next/navigation';
import { ids } from '@/features/jobs/schemas';
import { runnerBackLink } from '@/features/runner/back-link';
import { WheelRunner } from '@/features/runner/components/wheel-runner';
import { listPhotos } from '@/features/runner/server/photo-router';
import { RunnerBlocked } from '@/features/runner/components/runner-blocked';
import {
  assertMayRun,
  flaggedSpecMessage,
  listEvents,
  loadWheel,
  planFor,
  snapshotOf,
} from '@/features/runner/server/run';
import {
  recentPassingVerifications,
  wrenchesForEngine,
} from '@/features/tool-crib/server/wrenches';
import { formatTorque, threadConditionText } from '@/features/torque-plan';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { signInThenBackTo } from '@/server/auth/return-path';
import { DomainError, orNotFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Runner' };

export default async function RunPage({ params }: PageProps<'/jobs/[jobId]/wheels/[wheelId]/run'>) {
  const p = await params;
  const here = `/jobs/${p.jobId}/wheels/${p.wheelId}/run`;
  const member = await requireMember('jobs.run', here);
  const jobId = ids.job.safeParse(p.jobId);
  const wheelId = ids.wheel.safeParse(p.wheelId);
  if (!jobId.success || !wheelId.success) notFound();
  const ctx = await orNotFound(loadWheel(member.shopId, wheelId.data));
  if (ctx.job.id !== jobId.data) notFound();
  try {
    assertMayRun(member, ctx);
  } catch (error) {
    if (error instanceof DomainError && error.code === 'forbidden') forbidden();
    throw error;
  }
  const flagged = flaggedSpecMessage(ctx.spec);
  if (flagged)
    return (
      <RunnerBlocked
        jobId={ctx.job.id}
        jobNumber={ctx.job.number}
        specId={ctx.spec.id}
        message={flagged}
      />
    );
  const { wheel } = ctx;
  const settings = await getShopSettings(member.shopId);
  const { verification } = settings;
  const [wrenches, verifications, events, photos] = await Promise.all([
    wrenchesForEngine(member.shopId),
    recentPassingVerifications(
      member.shopId,
      verification.recency === 'same_day' ? 1 : verification.days,
    ),
    listEvents(member.shopId, wheel.id),
    listPhotos(member.shopId, wheel.id),
  ]);
  // Once the run started, the wheel's snapshot: a spec edited since changes nothing here.
  const snap = snapshotOf(ctx);
  const targets = snap.plan.passes.map((x) => x.target);
  return (
    <WheelRunner
      jobId={ctx.job.id}
      jobNumber={ctx.job.number}
      wheel={{
        id: wheel.id,
        position: wheel.position,
        tireSize: wheel.tireSize,
        directional: wheel.directional,
        targetPressure: wheel.targetPressure,
        pressureUnit: wheel.pressureUnit,
      }}
      spec={{
        name: snap.spec.name,
        maxBeadSeatPressure: snap.spec.maxBeadSeatPressure.value,
        pressureUnit: snap.spec.maxBeadSeatPressure.unit,
        lugTorque: snap.spec.lugTorque ? formatTorque(snap.spec.lugTorque, 1) : null,
        lug: { torque: snap.spec.lugTorque, count: snap.spec.lugCount },
        words: {
          makerReference: snap.spec.makerReference,
          notes: snap.spec.notes ?? ctx.spec.notes,
          threadCondition: threadConditionText(
            snap.spec.threadCondition === undefined
              ? ctx.spec.threadCondition
              : snap.spec.threadCondition,
          ),
          boltReuse: snap.spec.boltReuse ?? ctx.spec.boltReuse,
        },
      }}
      plan={planFor(ctx)}
      targets={targets}
      wrenches={wrenches}
      verifications={verifications}
      rules={{
        minFractionOfMax: settings.wrenchFloorPercent / 100,
        verification,
        timeZone: settings.timeZone,
      }}
      events={events}
      photos={photos}
      signInHref={signInThenBackTo(here)}
      rework={
        wheel.rework && !wheel.submittedAt
          ? { note: wheel.rework.note, steps: wheel.rework.steps, at: wheel.rework.at }
          : null
      }
      person={{ id: member.userId, name: member.name }}
      back={runnerBackLink(member, ctx.job)}
      mayRecordVerifications={can(member, 'verifications.record')}
    />
  );
}
