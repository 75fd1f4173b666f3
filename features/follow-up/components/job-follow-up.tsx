import { getShopSettings } from '@/server/shop/settings';
import { getFollowUp } from '../server/status';
import { FollowUpPanel } from './follow-up-panel';

/** The job card's follow-up section (a server component): reads its rows, then the panel. */
export async function JobFollowUp({
  shopId,
  jobId,
  canManage,
}: {
  shopId: string;
  jobId: string;
  canManage: boolean;
}) {
  const [followUp, { timeZone }] = await Promise.all([
    getFollowUp(shopId, jobId),
    getShopSettings(shopId),
  ]);
  return (
    <FollowUpPanel jobId={jobId} followUp={followUp} canManage={canManage} timeZone={timeZone} />
  );
}
