import Link from 'next/link';
import { UNIT_LABELS } from '@/features/torque-plan';
import type { CribWrenchDto } from '../server/wrenches';
import { CalibrationDue } from './calibration-due';
import { StatusBadge } from './status-badge';

export function WrenchTable({ wrenches }: { wrenches: CribWrenchDto[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Torque wrenches in the tool crib</caption>
        <thead>
          <tr className="border-ink border-b-2">
            <th scope="col" className="p-2">
              Wrench
            </th>
            <th scope="col" className="p-2">
              Range
            </th>
            <th scope="col" className="p-2">
              Calibration due
            </th>
            <th scope="col" className="p-2">
              Status
            </th>
          </tr>
        </thead>
        <tbody>
          {wrenches.map((w) => (
            <tr key={w.id} className="border-paper-line border-b align-top">
              <th scope="row" className="p-2">
                <Link
                  href={`/tool-crib/${w.id}`}
                  className="min-h-touch text-work inline-flex items-center font-semibold underline"
                >
                  {w.label}
                </Link>
                <span className="text-ink-soft block text-sm font-normal">
                  {w.kind}
                  {w.serial ? ` · S/N ${w.serial}` : ''}
                </span>
              </th>
              <td className="p-2">
                {w.min}–{w.max} {UNIT_LABELS[w.unit]}{' '}
                <span className="text-ink-soft block text-sm">steps of {w.graduation}</span>
              </td>
              <td className="p-2">
                <CalibrationDue day={w.calibrationDueOn} />
              </td>
              <td className="p-2">
                <StatusBadge status={w.status} />
                {w.statusReason ? (
                  <span className="mt-1 block text-sm">{w.statusReason}</span>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
