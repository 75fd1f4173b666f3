'use client';

import { CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from 'recharts';
import { useShopTime } from '@/features/ui/shop-time-zone';
import type { ScoreSeries } from '../progress';

// Colours that stay apart on white and for the common colour-vision differences, each line also
// with its own dash, so no line is told apart by colour alone.
const STROKES = ['#0a4f8a', '#b3261e', '#1d6b36', '#7a4b00', '#5b2a86', '#101317'];
const DASHES = ['', '6 3', '2 3', '10 4 2 4', '1 1', '12 6'];

/**
 * Scores over time, one line per apprentice and level. Hidden from assistive technology: the
 * table beside it holds the same figures.
 */
export function ScoreChart({ series }: { series: ScoreSeries[] }) {
  const { format } = useShopTime();
  const times = series.flatMap((s) => s.points.map((p) => p.at));
  if (times.length === 0) return null;
  return (
    <div aria-hidden="true" className="h-72 w-full" data-testid="score-chart">
      <LineChart
        responsive
        style={{ width: '100%', height: '100%' }}
        margin={{ top: 8, right: 12, bottom: 8, left: 0 }}
      >
        <CartesianGrid stroke="#c9ced4" strokeDasharray="3 3" />
        <XAxis
          dataKey="at"
          type="number"
          scale="time"
          domain={[Math.min(...times), Math.max(...times)]}
          tickFormatter={(at: number) => format(at, 'date')}
          allowDuplicatedCategory={false}
        />
        <YAxis domain={[0, 100]} ticks={[0, 25, 50, 75, 100]} width={36} />
        <Tooltip
          labelFormatter={(at) => format(Number(at), 'dateTime')}
          formatter={(score) => [`${String(score)} / 100`, 'Score']}
        />
        <Legend />
        {series.map((s, i) => (
          <Line
            key={s.key}
            data={s.points}
            dataKey="score"
            name={s.label}
            stroke={STROKES[i % STROKES.length]}
            strokeDasharray={DASHES[(i + Math.floor(i / STROKES.length)) % DASHES.length]}
            strokeWidth={2}
            isAnimationActive={false}
          />
        ))}
      </LineChart>
    </div>
  );
}
