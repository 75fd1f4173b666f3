import { LEVEL_NAMES, type LevelTrend } from '../progress';

function change(points: number | null) {
  if (points === null) return <span className="text-ink-soft">not enough attempts yet</span>;
  if (points === 0) return 'level';
  return points > 0 ? `up ${points} points` : `down ${Math.abs(points)} points`;
}

/** Per level: the mean of the latest five finished attempts beside the five before them. */
export function TrendTable({ trends, caption }: { trends: LevelTrend[]; caption: string }) {
  if (trends.length === 0) return <p className="text-ink-soft">No finished attempts yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="mb-2 text-left font-semibold">{caption}</caption>
        <thead>
          <tr className="border-ink border-b-2">
            <th scope="col" className="p-2">
              Level
            </th>
            <th scope="col" className="p-2 text-right">
              Last 5
            </th>
            <th scope="col" className="p-2 text-right">
              5 before
            </th>
            <th scope="col" className="p-2">
              Trend
            </th>
          </tr>
        </thead>
        <tbody>
          {trends.map((t) => (
            <tr key={t.level} className="border-paper-line border-b">
              <th scope="row" className="p-2">
                {LEVEL_NAMES[t.level]}{' '}
                <span className="text-ink-soft text-sm font-normal">({t.finished} finished)</span>
              </th>
              <td className="p-2 text-right tabular-nums">{t.recent ?? '—'}</td>
              <td className="p-2 text-right tabular-nums">{t.before ?? '—'}</td>
              <td className="p-2">{change(t.change)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
