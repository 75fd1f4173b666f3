'use client';

import type { ReactNode } from 'react';
import { BoltCircle } from '@/features/bolt-circle/bolt-circle';

/** A flagged wheel (failed inspection or a bolt problem): what happened, and leave it for a lead. */
export function WheelStopped({
  reason,
  boltCount,
  flaggedBolts,
  finish,
}: {
  reason: string;
  boltCount: number;
  flaggedBolts: readonly number[];
  /** Practice's own Finish, when this is a practice attempt. */
  finish?: ReactNode;
}) {
  return (
    <div role="alert" className="border-danger bg-danger-tint text-danger rounded-xl border-4 p-4">
      <p className="text-xl font-black">
        {flaggedBolts.length
          ? 'Wheel stopped: problem with a bolt'
          : 'Wheel stopped: inspection failed'}
      </p>
      <p>{reason}</p>
      <p className="mt-2 font-semibold">
        Leave the wheel as it is: it is flagged for a lead, and nothing goes back on the vehicle
        until a lead has looked at it and the parts are right.
      </p>
      {finish ? <div className="mt-3">{finish}</div> : null}
      {flaggedBolts.length ? (
        <div className="mt-3 bg-white">
          <BoltCircle
            count={boltCount}
            done={[]}
            mode="preview"
            flagged={flaggedBolts}
            label={`Bolt circle: bolt ${flaggedBolts.join(', ')} flagged`}
          />
        </div>
      ) : null}
    </div>
  );
}
