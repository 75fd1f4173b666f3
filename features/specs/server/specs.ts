import 'server-only';
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { wheelSpecs, type WheelSpecRow } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import { engineErrors } from '../engine-check';
import type { SpecInput } from '../schemas';

export type Spec = Omit<WheelSpecRow, 'shopId' | 'createdAt' | 'updatedAt' | 'passFractions'> & {
  passPercents: number[];
  updatedAt: string;
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
  updatedAt: wheelSpecs.updatedAt,
};

type Row = Omit<WheelSpecRow, 'shopId' | 'createdAt'>;

const toDto = ({ passFractions, updatedAt, ...rest }: Row): Spec => ({
  ...rest,
  passPercents: passFractions.map((f) => Math.round(f * 1e6) / 1e4),
  updatedAt: updatedAt.toISOString(),
});

function toRow(input: SpecInput) {
  const errors = engineErrors(input);
  if (errors) throw new DomainError('invalid', 'The torque-plan engine refuses this spec; see the fields.', errors);
  return {
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
  };
}

export async function listSpecs(shopId: string): Promise<Spec[]> {
  const rows = await getDb().select(columns).from(wheelSpecs).where(eq(wheelSpecs.shopId, shopId)).orderBy(asc(wheelSpecs.name));
  return rows.map(toDto);
}

export async function getSpec(shopId: string, specId: string): Promise<Spec> {
  const [row] = await getDb().select(columns).from(wheelSpecs).where(and(eq(wheelSpecs.shopId, shopId), eq(wheelSpecs.id, specId)));
  if (!row) throw notFound('That wheel spec');
  return toDto(row);
}

export async function createSpec(actor: Member, input: SpecInput): Promise<Spec> {
  const [row] = await getDb().insert(wheelSpecs).values({ ...toRow(input), shopId: actor.shopId }).returning(columns);
  return toDto(row!);
}

export async function updateSpec(actor: Member, specId: string, input: SpecInput): Promise<Spec> {
  const [row] = await getDb()
    .update(wheelSpecs)
    .set({ ...toRow(input), updatedAt: new Date() })
    .where(and(eq(wheelSpecs.shopId, actor.shopId), eq(wheelSpecs.id, specId)))
    .returning(columns);
  if (!row) throw notFound('That wheel spec');
  return toDto(row);
}
