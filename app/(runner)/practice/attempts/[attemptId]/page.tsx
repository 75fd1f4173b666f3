import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { PracticeRunner } from '@/features/practice/components/practice-runner';
import { practicePlan } from '@/features/practice/plan';
import { attemptId } from '@/features/practice/schemas';
import { attemptFor, listPracticeEvents } from '@/features/practice/server/attempts';
import { formatTorque, threadConditionText } from '@/features/torque-plan';
import { requireMember } from '@/server/auth/guard';
import { signInThenBackTo } from '@/server/auth/return-path';
import { orNotFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Practice' };

/** The runner on a simulated wheel; a finished attempt, or someone else's, shows its result. */
export default async function PracticeRunPage({
  params,
}: PageProps<'/practice/attempts/[attemptId]'>) {
  const p = await params;
  const here = `/practice/attempts/${p.attemptId}`;
  const member = await requireMember('practice.run', here);
  const id = attemptId.safeParse(p.attemptId);
  if (!id.success) notFound();
  const attempt = await orNotFound(attemptFor(member, id.data));
  if (attempt.finishedAt || attempt.userId !== member.userId) redirect(`${here}/result`);
  const { setup } = attempt;
  const snap = setup.snapshot;
  const [settings, events] = await Promise.all([
    getShopSettings(member.shopId),
    listPracticeEvents(member.shopId, attempt.id),
  ]);
  return (
    <PracticeRunner
      attemptId={attempt.id}
      level={setup.level}
      jobId={attempt.id}
      jobNumber={0}
      wheel={{ id: attempt.id, ...setup.wheel }}
      spec={{
        name: snap.spec.name,
        maxBeadSeatPressure: snap.spec.maxBeadSeatPressure.value,
        pressureUnit: snap.spec.maxBeadSeatPressure.unit,
        lugTorque: snap.spec.lugTorque ? formatTorque(snap.spec.lugTorque, 1) : null,
        lug: { torque: snap.spec.lugTorque, count: snap.spec.lugCount },
        words: {
          makerReference: snap.spec.makerReference,
          notes: snap.spec.notes ?? '',
          threadCondition: threadConditionText(snap.spec.threadCondition ?? null),
          boltReuse: snap.spec.boltReuse ?? '',
        },
      }}
      plan={practicePlan(setup)}
      targets={snap.plan.passes.map((x) => x.target)}
      wrenches={setup.wrenches}
      verifications={[]}
      rules={{
        minFractionOfMax: setup.minFractionOfMax,
        verification: settings.verification,
        timeZone: settings.timeZone,
      }}
      events={events}
      photos={[]}
      signInHref={signInThenBackTo(here)}
      rework={null}
      person={{ id: member.userId, name: member.name }}
    />
  );
}
