import 'server-only';
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { wheelSpecs, type WheelSpecRow } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import { specErrors } from '../engine-check';
import type { SpecInput } from '../schemas';

export type Spec = Omit<
  WheelSpecRow,
  'shopId' | 'createdAt' | 'updatedAt' | 'passFractions' | 'beadSeatRatingConfirmedAt'
> & {
  passPercents: number[];
  updatedAt: string;
  beadSeatRatingConfirmedAt: string | null;
};

const columns = {
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
  beadSeatRatingReference: wheelSpecs.beadSeatRatingReference,
  beadSeatRatingConfirmedById: wheelSpecs.beadSeatRatingConfirmedById,
  beadSeatRatingConfirmedAt: wheelSpecs.beadSeatRatingConfirmedAt,
  plausibilityFlag: wheelSpecs.plausibilityFlag,
  updatedAt: wheelSpecs.updatedAt,
};

type Row = Omit<WheelSpecRow, 'shopId' | 'createdAt'>;

const toDto = ({ passFractions, updatedAt, beadSeatRatingConfirmedAt, ...rest }: Row): Spec => ({
  ...rest,
  passPercents: passFractions.map((f) => Math.round(f * 1e6) / 1e4),
  updatedAt: updatedAt.toISOString(),
  beadSeatRatingConfirmedAt: beadSeatRatingConfirmedAt?.toISOString() ?? null,
});

type Confirmation = Pick<
  Row,
  | 'beadSeatRatingConfirmedById'
  | 'beadSeatRatingConfirmedAt'
  | 'beadSeatRatingReference'
  | 'maxBeadSeatPressure'
  | 'pressureUnit'
>;

/**
 * Who vouches for the tire maker's higher rating: only a lead may tick the box. A confirmation
 * stays with its lead and time while the reference and the limit stay as they were confirmed.
 */
function confirmationOf(actor: Member, input: SpecInput, before?: Confirmation) {
  const reference = input.beadSeatRatingReference.trim();
  if (!input.beadSeatRatingConfirmed || !reference)
    return { beadSeatRatingConfirmedById: null, beadSeatRatingConfirmedAt: null };
  const unchanged =
    before?.beadSeatRatingConfirmedAt &&
    before.beadSeatRatingReference === reference &&
    before.maxBeadSeatPressure === input.maxBeadSeatPressure &&
    before.pressureUnit === input.pressureUnit;
  if (unchanged)
    return {
      beadSeatRatingConfirmedById: before.beadSeatRatingConfirmedById,
      beadSeatRatingConfirmedAt: before.beadSeatRatingConfirmedAt,
    };
  if (actor.role !== 'lead') {
    throw new DomainError('forbidden', "Only a lead can confirm a tire maker's bead-seat rating.", {
      beadSeatRatingConfirmed: ["Only a lead can confirm the tire maker's rating."],
    });
  }
  return { beadSeatRatingConfirmedById: actor.userId, beadSeatRatingConfirmedAt: new Date() };
}

/** The row to store, or a refusal naming each field: the engine's checks, then plausibility. */
function toRow(actor: Member, input: SpecInput, before?: Confirmation) {
  const errors = specErrors(input);
  if (errors) {
    const first = Object.values(errors)[0]?.[0] ?? '';
    throw new DomainError('invalid', `This spec is refused, nothing was saved: ${first}`, errors);
  }
  return {
    ...confirmationOf(actor, input, before),
    beadSeatRatingReference: input.beadSeatRatingReference.trim(),
    // A spec that passes every check is no longer flagged (a lead fixed it).
    plausibilityFlag: null,
    name: input.name,
    boltCount: input.boltCount,
    boltThread: input.boltThread,
    finalTorque: input.finalTorque,
    torqueUnit: input.torqueUnit,
    passFractions: input.passPercents.map((p) => p / 100),
    patternKind: input.patternKind,
    skipStep: input.patternKind === 'skip' ? (input.skipStep ?? null) : null,
    checkPass: input.checkPass,
    lugTorque: input.lugTorque ?? null,
    lugTorqueUnit: input.lugTorque === undefined ? null : (input.lugTorqueUnit ?? null),
    lugCount: input.lugCount ?? null,
    maxBeadSeatPressure: input.maxBeadSeatPressure,
    runningPressure: input.runningPressure,
    pressureUnit: input.pressureUnit,
    makerReference: input.makerReference,
    notes: input.notes,
    threadCondition: input.threadCondition ?? null,
    boltReuse: input.boltReuse,
  };
}

export async function listSpecs(shopId: string): Promise<Spec[]> {
  const rows = await getDb()
    .select(columns)
    .from(wheelSpecs)
    .where(eq(wheelSpecs.shopId, shopId))
    .orderBy(asc(wheelSpecs.name));
  return rows.map(toDto);
}

async function getSpecRow(shopId: string, specId: string): Promise<Row> {
  const [row] = await getDb()
    .select(columns)
    .from(wheelSpecs)
    .where(and(eq(wheelSpecs.shopId, shopId), eq(wheelSpecs.id, specId)));
  if (!row) throw notFound('That wheel spec');
  return row;
}

export async function getSpec(shopId: string, specId: string): Promise<Spec> {
  return toDto(await getSpecRow(shopId, specId));
}

export async function createSpec(actor: Member, input: SpecInput): Promise<Spec> {
  const [row] = await getDb()
    .insert(wheelSpecs)
    .values({ ...toRow(actor, input), shopId: actor.shopId })
    .returning(columns);
  return toDto(row!);
}

export async function updateSpec(actor: Member, specId: string, input: SpecInput): Promise<Spec> {
  const before = await getSpecRow(actor.shopId, specId);
  const [row] = await getDb()
    .update(wheelSpecs)
    .set({ ...toRow(actor, input, before), updatedAt: new Date() })
    .where(and(eq(wheelSpecs.shopId, actor.shopId), eq(wheelSpecs.id, specId)))
    .returning(columns);
  if (!row) throw notFound('That wheel spec');
  return toDto(row);
}
