import { ShopTime } from '@/features/ui/shop-time-zone';
import type { ScoreSeries } from '../progress';

/** The chart's figures as a table: every finished attempt of each apprentice and level. */
export function ScoreTable({ series }: { series: ScoreSeries[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="mb-2 text-left font-semibold">
          Scores over time, per apprentice and level (the chart shows the same figures)
        </caption>
        <thead>
          <tr className="border-ink border-b-2">
            <th scope="col" className="p-2">
              Apprentice and level
            </th>
            <th scope="col" className="p-2">
              Finished
            </th>
            <th scope="col" className="p-2 text-right">
              Score
            </th>
          </tr>
        </thead>
        {series.map((s) => (
          <tbody key={s.key} className="border-paper-line border-b-2">
            {s.points.map((p, i) => (
              <tr key={p.attemptId}>
                {i === 0 ? (
                  <th scope="rowgroup" rowSpan={s.points.length} className="p-2 align-top">
                    {s.label}
                  </th>
                ) : null}
                <td className="p-2">
                  <ShopTime when={new Date(p.at).toISOString()} />
                </td>
                <td className="p-2 text-right font-semibold tabular-nums">{p.score}</td>
              </tr>
            ))}
          </tbody>
        ))}
      </table>
    </div>
  );
}
