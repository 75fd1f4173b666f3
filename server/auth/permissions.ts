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
  /** Cancel or move the re-check reminder, send the customer e-mail again. */
  'followup.manage',
  'practice.run',
  'practice.viewOthers',
  'practice.clear',
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

/**
 * What a lead's clearance adds for an apprentice: running the real wheels assigned to them
 * (practice_clearances, read into the session; assignment checks it again in the jobs feature).
 */
const CLEARED_APPRENTICE: ReadonlySet<Permission> = new Set<Permission>(['jobs.run']);

/** A person as the guards know them: a role, and for an apprentice whether a lead has cleared them. */
export type Grantee = { role: Role; clearedForRealWheels?: boolean };

export function can(who: Role | Grantee | undefined | null, permission: Permission): boolean {
  if (!who) return false;
  const { role, clearedForRealWheels } = typeof who === 'string' ? { role: who } : who;
  if (GRANTS[role]?.has(permission)) return true;
  return (
    role === 'apprentice' && clearedForRealWheels === true && CLEARED_APPRENTICE.has(permission)
  );
}

export const ROLE_LABELS: Record<Role, string> = {
  lead: 'Lead',
  technician: 'Technician',
  apprentice: 'Apprentice',
};
