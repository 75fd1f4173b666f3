import { describe, expect, it } from 'vitest';
import { runnerBackLink } from '@/features/runner/back-link';

const job = { id: '33333333-3333-4333-8333-333333333333', number: 42 };

describe("the runner's back link", () => {
  it('goes to the job card for those who may open it', () => {
    for (const role of ['lead', 'technician'] as const)
      expect(runnerBackLink({ role }, job)).toEqual({
        href: '/jobs/33333333-3333-4333-8333-333333333333',
        label: 'Job #42',
      });
  });

  it('goes to My wheels for a cleared apprentice, who may run the wheel but not open the job card', () => {
    expect(runnerBackLink({ role: 'apprentice', clearedForRealWheels: true }, job)).toEqual({
      href: '/my-wheels',
      label: 'My wheels',
    });
  });
});
