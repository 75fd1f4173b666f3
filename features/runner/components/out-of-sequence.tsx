'use client';

import type { PassProgress } from '../state';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';
const warn = `${big} border-caution bg-caution-tint text-caution-ink border-4`;

/**
 * A bolt tapped on the ring that is not the next one: undo it when already done, else confirm it
 * anyway (on a check pass: turned or not), recorded as out of sequence.
 */
export function OutOfSequence({
  pass,
  bolt,
  confirm,
  undo,
}: {
  pass: PassProgress;
  bolt: number;
  confirm: (at: number, bolt: number, turned?: boolean) => void;
  undo: (bolt: number) => void;
}) {
  if (pass.confirmed.includes(bolt))
    return (
      <button type="button" onClick={() => undo(bolt)} className={`${big} border-ink border-2`}>
        Undo bolt {bolt}
      </button>
    );
  if (pass.kind === 'check')
    return (
      <div className="grid grid-cols-2 gap-2">
        <button type="button" onClick={(e) => confirm(e.timeStamp, bolt, true)} className={warn}>
          Bolt {bolt}, out of sequence: turned
        </button>
        <button type="button" onClick={(e) => confirm(e.timeStamp, bolt, false)} className={warn}>
          Bolt {bolt}, out of sequence: didn&apos;t turn
        </button>
      </div>
    );
  return (
    <button type="button" onClick={(e) => confirm(e.timeStamp, bolt)} className={warn}>
      Bolt {bolt} is out of sequence: confirm it anyway
    </button>
  );
}
