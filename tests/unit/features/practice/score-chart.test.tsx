// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ScoreChart } from '@/features/practice/components/score-chart';
import { ScoreTable } from '@/features/practice/components/score-table';
import { scoreSeries, type ProgressAttempt } from '@/features/practice/progress';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';

const attempt = (id: string, personName: string, score: number, iso: string): ProgressAttempt => ({
  id,
  userId: personName,
  personName,
  level: 'from_memory',
  source: 'surprise',
  ringName: '',
  startedAt: new Date(iso),
  finishedAt: new Date(iso),
  score,
});

describe('the lead’s chart and the table beside it', () => {
  const series = scoreSeries([
    attempt('a1', 'Pip Trainee', 64, '2026-11-03T16:30:00Z'),
    attempt('a2', 'Pip Trainee', 88, '2026-11-10T16:30:00Z'),
    attempt('a3', 'Rue Novice', 71, '2026-11-04T16:30:00Z'),
  ]);

  it('the table holds every score the chart draws, per apprentice and level, on the shop’s clock', () => {
    render(
      <ShopTimeZoneProvider timeZone="America/Denver">
        <ScoreTable series={series} />
      </ShopTimeZoneProvider>,
    );
    const table = screen.getByRole('table', { name: /Scores over time/ });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => r.textContent)).toEqual([
      // 16:30 UTC is 9:30 in Denver in November (MST, UTC−7).
      expect.stringMatching(/^Pip Trainee — From memoryNov 3, 2026.*9:30.*64$/),
      expect.stringMatching(/^Nov 10, 2026.*9:30.*88$/),
      expect.stringMatching(/^Rue Novice — From memoryNov 4, 2026.*9:30.*71$/),
    ]);
  });

  it('the chart is hidden from screen readers, which read the table instead', () => {
    const { container } = render(
      <ShopTimeZoneProvider timeZone="America/Denver">
        <ScoreChart series={series} />
      </ShopTimeZoneProvider>,
    );
    expect(container.firstElementChild?.getAttribute('aria-hidden')).toBe('true');
    expect(screen.queryByRole('img')).toBeNull();
  });
});
