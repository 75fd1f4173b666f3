import { describe, expect, it } from 'vitest';
import { can, PERMISSIONS } from '@/server/auth/permissions';

// The role table of the product brief, row by row.
describe('permissions', () => {
  it('a lead may do everything', () => {
    for (const p of PERMISSIONS) expect(can('lead', p)).toBe(true);
  });
  it('a technician records verifications, creates and runs jobs, practises, but manages nothing', () => {
    expect(can('technician', 'verifications.record')).toBe(true);
    expect(can('technician', 'jobs.create')).toBe(true);
    expect(can('technician', 'jobs.run')).toBe(true);
    expect(can('technician', 'practice.run')).toBe(true);
    for (const p of [
      'team.manage',
      'shop.settings',
      'specs.manage',
      'wrenches.manage',
      'wrenches.clear',
      'jobs.assign',
      'jobs.edit',
      'jobs.signoff',
      'practice.viewOthers',
    ] as const) {
      expect(can('technician', p)).toBe(false);
    }
  });
  it('an apprentice practises and sees the board, nothing else', () => {
    expect(can('apprentice', 'practice.run')).toBe(true);
    expect(can('apprentice', 'jobs.run')).toBe(false);
    expect(can('apprentice', 'verifications.record')).toBe(false);
    expect(can('apprentice', 'team.manage')).toBe(false);
  });
  it('a cleared apprentice may also run real wheels, and nothing more; clearing a technician adds nothing', () => {
    const cleared = { role: 'apprentice', clearedForRealWheels: true } as const;
    expect(can(cleared, 'jobs.run')).toBe(true);
    expect(can({ role: 'apprentice', clearedForRealWheels: false }, 'jobs.run')).toBe(false);
    for (const p of PERMISSIONS.filter((p) => p !== 'jobs.run'))
      expect(can(cleared, p), p).toBe(can('apprentice', p));
    expect(can({ role: 'technician', clearedForRealWheels: true }, 'jobs.assign')).toBe(false);
  });
  it('only a lead clears apprentices and sees their attempts', () => {
    for (const role of ['technician', 'apprentice'] as const) {
      expect(can(role, 'practice.clear')).toBe(false);
      expect(can(role, 'practice.viewOthers')).toBe(false);
    }
    expect(can('lead', 'practice.clear')).toBe(true);
  });
  it('denies by default', () => {
    expect(can(undefined, 'board.view')).toBe(false);
    expect(can('owner' as never, 'board.view')).toBe(false);
  });
});
