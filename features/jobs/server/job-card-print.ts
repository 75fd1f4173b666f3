import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobWheels, wheelSpecs } from '@/db/schema';
import type { PressureUnit, ThreadCondition, TorqueUnit } from '@/features/torque-plan';
import { qrSvg } from '@/features/ui/qr-svg';
import { env } from '@/server/env.mjs';
import { POSITIONS } from '../schemas';

/** One wheel's card on the printed job card: what the technician checks at the cart, and the code to its runner. */
export type PrintedWheel = {
  id: string;
  position: (typeof POSITIONS)[number];
  spec: {
    name: string;
    boltCount: number;
    boltThread: string;
    pattern: { kind: 'cross' | 'skip' | 'sequential'; step: number | null };
    finalTorque: { value: number; unit: TorqueUnit };
    threadCondition: ThreadCondition | null;
    makerReference: string;
    /** Why the spec fails the plausibility rules: the runner will not start the wheel. */
    flag: string | null;
  };
  tireSize: string;
  directional: boolean;
  targetPressure: { value: number; unit: PressureUnit };
  /** The runner's address on the app's public origin (APP_URL), as the QR code carries it. */
  runnerUrl: string;
  qrSvg: string;
};

/** The address a phone opens from the card; signed out, the runner sends it through sign-in and back. */
export const runnerUrl = (jobId: string, wheelId: string, appUrl = env().APP_URL) =>
  new URL(`/jobs/${jobId}/wheels/${wheelId}/run`, appUrl).toString();

/**
 * The wheels of one job card as printed. A wheel whose run has started shows the spec frozen in
 * its snapshot, which is what its runner follows; the others show the spec as it stands now.
 */
export async function getPrintedWheels(shopId: string, jobId: string): Promise<PrintedWheel[]> {
  const rows = await getDb()
    .select({
      id: jobWheels.id,
      position: jobWheels.position,
      tireSize: jobWheels.tireSize,
      directional: jobWheels.directional,
      targetPressure: jobWheels.targetPressure,
      pressureUnit: jobWheels.pressureUnit,
      snapshot: jobWheels.snapshot,
      name: wheelSpecs.name,
      boltCount: wheelSpecs.boltCount,
      boltThread: wheelSpecs.boltThread,
      patternKind: wheelSpecs.patternKind,
      skipStep: wheelSpecs.skipStep,
      finalTorque: wheelSpecs.finalTorque,
      torqueUnit: wheelSpecs.torqueUnit,
      threadCondition: wheelSpecs.threadCondition,
      makerReference: wheelSpecs.makerReference,
      flag: wheelSpecs.plausibilityFlag,
    })
    .from(jobWheels)
    .innerJoin(
      wheelSpecs,
      and(eq(wheelSpecs.id, jobWheels.specId), eq(wheelSpecs.shopId, jobWheels.shopId)),
    )
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  const wheels = rows.map(async (row): Promise<PrintedWheel> => {
    const frozen = row.snapshot?.spec;
    const url = runnerUrl(jobId, row.id);
    return {
      id: row.id,
      position: row.position,
      spec: {
        name: frozen?.name ?? row.name,
        boltCount: frozen?.boltCount ?? row.boltCount,
        boltThread: frozen?.boltThread ?? row.boltThread,
        pattern: frozen?.pattern ?? { kind: row.patternKind, step: row.skipStep },
        finalTorque: frozen?.finalTorque ?? { value: row.finalTorque, unit: row.torqueUnit },
        threadCondition: frozen ? (frozen.threadCondition ?? null) : row.threadCondition,
        makerReference: frozen?.makerReference ?? row.makerReference,
        flag: row.flag,
      },
      tireSize: row.tireSize,
      directional: row.directional,
      targetPressure: { value: row.targetPressure, unit: row.pressureUnit },
      runnerUrl: url,
      qrSvg: await qrSvg(url),
    };
  });
  return (await Promise.all(wheels)).sort(
    (a, b) => POSITIONS.indexOf(a.position) - POSITIONS.indexOf(b.position),
  );
}
