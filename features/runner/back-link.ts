import { can, type Grantee } from '@/server/auth/permissions';

export type BackLink = { href: string; label: string };

/**
 * Where the runner's "←" goes. People who may see job cards go back to this one; a cleared
 * apprentice may run their wheels but not open job cards (that page would only say 403), so they
 * go back to My wheels, the list their wheels came from.
 */
export function runnerBackLink(who: Grantee, job: { id: string; number: number }): BackLink {
  return can(who, 'jobs.view')
    ? { href: `/jobs/${job.id}`, label: `Job #${job.number}` }
    : { href: '/my-wheels', label: 'My wheels' };
}
