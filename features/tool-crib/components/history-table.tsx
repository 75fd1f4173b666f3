import { UNIT_LABELS } from '@/features/torque-plan';
import { ShopTime } from '@/features/ui/shop-time-zone';
import type { WrenchHistoryEntry } from '../server/wrenches';

export function HistoryTable({ entries }: { entries: WrenchHistoryEntry[] }) {
  if (entries.length === 0)
    return (
      <p className="text-ink-soft">
        No verifications yet. Record one before the wrench’s first pass of the day.
      </p>
    );
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Verification and service history, newest first</caption>
        <thead>
          <tr className="border-ink border-b-2">
            <th scope="col" className="p-2">
              When
            </th>
            <th scope="col" className="p-2">
              What
            </th>
            <th scope="col" className="p-2">
              Who
            </th>
          </tr>
        </thead>
        <tbody>
          {entries.map((e, i) => (
            <tr key={`${e.at}-${i}`} className="border-paper-line border-b align-top">
              <td className="p-2 whitespace-nowrap">
                <ShopTime when={e.at} />
              </td>
              <td className="p-2">
                {e.type === 'verification' ? (
                  <>
                    Verification: reference {e.referenceValue}, reading {e.readingValue}{' '}
                    {UNIT_LABELS[e.unit]} →{' '}
                    <strong>
                      {e.deviationPct > 0 ? '+' : ''}
                      {e.deviationPct.toFixed(1)} % {e.withinTolerance ? 'within' : 'OUT OF'} ±
                      {e.tolerancePct} %
                    </strong>
                  </>
                ) : (
                  <>
                    <strong>
                      {e.status === 'in_service' ? 'Back in service' : 'Out of service'}
                    </strong>
                    : {e.reason}
                  </>
                )}
              </td>
              <td className="p-2">{e.by ?? 'Ringpass (automatic)'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
