import type { Role } from '@/db/schema';

/**
 * Who may do what, deny by default. Pure: pages use it to hide controls, the data layer and the
 * guards use it to refuse. Rows (which shop, which assignee) are checked where the data is read.
 */
export const PERMISSIONS = [
  'board.view',
  'jobs.view',
  'team.manage',
  'shop.settings',
  'specs.manage',
  'wrenches.manage',
  'wrenches.clear',
  'verifications.record',
  'jobs.create',
  'jobs.assign',
  'jobs.edit',
  'jobs.run',
  'jobs.signoff',
  'reports.download',
  'reports.links',
  'practice.run',
  'practice.viewOthers',
  'plans.compute',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const GRANTS: Record<Role, ReadonlySet<Permission>> = {
  lead: new Set(PERMISSIONS),
  technician: new Set<Permission>([
    'board.view',
    'jobs.view',
    'verifications.record',
    'jobs.create',
    'jobs.run',
    'reports.download',
    'practice.run',
    'plans.compute',
  ]),
  apprentice: new Set<Permission>(['board.view', 'practice.run', 'plans.compute']),
};

export function can(role: Role | undefined | null, permission: Permission): boolean {
  if (!role) return false;
  return GRANTS[role]?.has(permission) ?? false;
}

export const ROLE_LABELS: Record<Role, string> = {
  lead: 'Lead',
  technician: 'Technician',
  apprentice: 'Apprentice',
};
