import { describe, expect, it } from 'vitest';
import { photoKindEnum } from '@/db/schema';
import { CHECKLISTS } from '@/db/seed-demo-work';
import { runEventSchema } from '@/features/runner/events';
import {
  missingPhotos,
  PHOTO_KIND_INFO,
  PHOTO_KINDS,
  REQUIRED_PHOTOS,
} from '@/features/runner/photo-kinds';
import { STEP_IDS, stepsFor } from '@/features/runner/steps';

describe('one list of each thing', () => {
  it('the database stores exactly the photo kinds the runner offers, in the same order', () => {
    expect(photoKindEnum.enumValues).toEqual([...PHOTO_KINDS]);
  });

  it('both bead faces are required before a wheel is submitted; an extra photo is not', () => {
    expect(REQUIRED_PHOTOS).toEqual(['bead_outer', 'bead_inner']);
    expect(missingPhotos(['bead_inner', 'other'])).toEqual(['bead_outer']);
    expect(PHOTO_KIND_INFO.bead_outer.label).toBe('Seated bead, outer face');
  });

  it('the procedure with every optional step is exactly the step list events may name, in order', () => {
    expect(stepsFor({ dismount: true, reinstall: true }).map((s) => s.id)).toEqual([...STEP_IDS]);
  });

  it('an event naming a step outside the list is refused', () => {
    const event = (step: string) => ({
      clientId: crypto.randomUUID(),
      at: new Date().toISOString(),
      type: 'step_done',
      payload: { step, checklist: [] },
    });
    expect(runEventSchema.safeParse(event('seat_bead')).success).toBe(true);
    expect(runEventSchema.safeParse(event('paint_the_rim')).success).toBe(false);
  });

  it("the demo shop's records tick the runner's own checklist items, step by step", () => {
    const procedure = stepsFor({ dismount: true, reinstall: true }).filter(
      (s) => s.checklist.length,
    );
    expect(Object.fromEntries(procedure.map((s) => [s.id, s.checklist.map((c) => c.id)]))).toEqual(
      CHECKLISTS,
    );
  });
});
