'use client';

import { ShopDate, useShopTime } from '@/features/ui/shop-time-zone';

/** A calibration due date, flagged against the shop's own today (its calendar, not the server's). */
export function CalibrationDue({ day }: { day: string }) {
  const status = useShopTime().dayStatus(day);
  return (
    <>
      <ShopDate day={day} />
      {status === 'overdue' ? (
        <span className="text-danger block text-sm font-bold">■ Overdue</span>
      ) : null}
      {status === 'today' ? (
        <span className="text-caution-ink block text-sm font-bold">▲ Due today</span>
      ) : null}
    </>
  );
}
