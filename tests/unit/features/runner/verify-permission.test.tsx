// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { TorquePanel } from '@/features/runner/components/torque-panel';
import { reduceRun, type RunnerPlan } from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import type { WrenchRules } from '@/features/runner/wrench-gate';
import { CLICK_WRENCH } from '@/tests/helpers/runner-fixtures';

const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 4,
  passes: [{ index: 1, kind: 'staged', order: [1, 3, 2, 4] }],
};
// The shop wants a check today; the wrench has none, so the pass waits for one.
const rules: WrenchRules = {
  minFractionOfMax: 0.2,
  verification: { recency: 'same_day', days: 1, nearPercent: 0 },
  timeZone: 'UTC',
};

function renderPass(mayRecordVerifications: boolean) {
  return render(
    <TorquePanel
      state={reduceRun(plan, [])}
      targets={[{ value: 50, unit: 'lbf-ft' }]}
      wrenches={[CLICK_WRENCH]}
      verifications={[]}
      rules={rules}
      mayRecordVerifications={mayRecordVerifications}
      cautions={[]}
      boltCount={4}
      record={async () => {}}
    />,
  );
}

describe('a pass whose wrench needs a verification on the spot', () => {
  it('tells someone who may not record one (a cleared apprentice) to ask a lead or technician, with no form to fill', async () => {
    renderPass(false);
    // The check's words load when a pass needs them (not part of the runner's first load).
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'This wrench needs a check before this pass — ask a lead or technician to verify it',
    );
    expect(screen.getByRole('region', { name: 'Verify the wrench' })).toHaveTextContent(
      'TW-1: No passing verification',
    );
    expect(screen.queryByRole('button', { name: 'Record verification' })).toBeNull();
    expect(screen.queryByLabelText(/Reading/)).toBeNull();
    // The pass does not start either: no bolt to confirm.
    expect(screen.queryByRole('button', { name: /Wrench set/ })).toBeNull();
  });

  it('gives a lead or technician the inline form, as before', async () => {
    renderPass(true);
    expect(await screen.findByRole('button', { name: 'Record verification' })).toBeInTheDocument();
    expect(screen.getByLabelText('Reading (ft-lb)')).toBeInTheDocument();
    expect(screen.queryByText(/ask a lead or technician/)).toBeNull();
  });
});
