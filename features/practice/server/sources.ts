import 'server-only';
import { and, asc, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { wheelSpecs, wrenches } from '@/db/schema';
import { notFound } from '@/server/errors';
import type { PracticeWrench } from '../types';

const specColumns = {
  id: wheelSpecs.id,
  name: wheelSpecs.name,
  boltCount: wheelSpecs.boltCount,
  boltThread: wheelSpecs.boltThread,
  finalTorque: wheelSpecs.finalTorque,
  torqueUnit: wheelSpecs.torqueUnit,
  passFractions: wheelSpecs.passFractions,
  patternKind: wheelSpecs.patternKind,
  skipStep: wheelSpecs.skipStep,
  checkPass: wheelSpecs.checkPass,
  lugTorque: wheelSpecs.lugTorque,
  lugTorqueUnit: wheelSpecs.lugTorqueUnit,
  lugCount: wheelSpecs.lugCount,
  maxBeadSeatPressure: wheelSpecs.maxBeadSeatPressure,
  runningPressure: wheelSpecs.runningPressure,
  pressureUnit: wheelSpecs.pressureUnit,
  makerReference: wheelSpecs.makerReference,
  notes: wheelSpecs.notes,
  threadCondition: wheelSpecs.threadCondition,
  boltReuse: wheelSpecs.boltReuse,
};

/** The shop's specs an attempt may be drawn from: a flagged spec is not practised either. */
export async function practiceSpecs(shopId: string) {
  return getDb()
    .select({
      id: wheelSpecs.id,
      name: wheelSpecs.name,
      boltCount: wheelSpecs.boltCount,
      finalTorque: wheelSpecs.finalTorque,
      torqueUnit: wheelSpecs.torqueUnit,
    })
    .from(wheelSpecs)
    .where(and(eq(wheelSpecs.shopId, shopId), isNull(wheelSpecs.plausibilityFlag)))
    .orderBy(asc(wheelSpecs.name));
}

/** One spec of the shop with what a snapshot needs; another shop's or a flagged one is not found. */
export async function practiceSpec(shopId: string, specId: string) {
  const [row] = await getDb()
    .select(specColumns)
    .from(wheelSpecs)
    .where(
      and(
        eq(wheelSpecs.shopId, shopId),
        eq(wheelSpecs.id, specId),
        isNull(wheelSpecs.plausibilityFlag),
      ),
    );
  if (!row) throw notFound('That spec');
  return row;
}

/** The shop's in-service wrenches, read only: practice never counts a cycle or records a verification. */
export async function practiceWrenches(shopId: string): Promise<PracticeWrench[]> {
  return getDb()
    .select({
      id: wrenches.id,
      label: wrenches.label,
      min: wrenches.min,
      max: wrenches.max,
      unit: wrenches.unit,
      graduation: wrenches.graduation,
      kind: wrenches.kind,
    })
    .from(wrenches)
    .where(and(eq(wrenches.shopId, shopId), eq(wrenches.status, 'in_service')))
    .orderBy(asc(wrenches.label));
}
