import { ROLE_LABELS } from '@/server/auth/permissions';

export const ROLE_OPTIONS = (Object.keys(ROLE_LABELS) as (keyof typeof ROLE_LABELS)[]).map(
  (value) => ({
    value,
    label: ROLE_LABELS[value],
  }),
);
