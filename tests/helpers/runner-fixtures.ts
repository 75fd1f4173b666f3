import type { CribWrench } from '@/features/runner/wrench-gate';

/** The runner component tests' click wrench: 20–150 ft-lb, graduated in 1 ft-lb. */
export const CLICK_WRENCH: CribWrench = {
  id: '11111111-1111-4111-8111-111111111111',
  label: 'TW-1',
  min: 20,
  max: 150,
  unit: 'lbf-ft',
  graduation: 1,
  kind: 'click',
};
