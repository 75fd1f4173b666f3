import { describe, expect, it } from 'vitest';
import { levelTrends, scoreSeries, type ProgressAttempt } from '@/features/practice/progress';

const day = (n: number) => new Date(Date.UTC(2026, 10, n, 15));
let seq = 0;
const attempt = (over: Partial<ProgressAttempt>): ProgressAttempt => {
  seq += 1;
  return {
    id: `a${String(seq).padStart(3, '0')}`,
    userId: 'u1',
    personName: 'Ada Apprentice',
    level: 'from_memory',
    source: 'surprise',
    ringName: 'Ring',
    startedAt: day(1),
    finishedAt: day(1),
    score: 50,
    ...over,
  };
};

describe('levelTrends', () => {
  it('compares the latest five finished attempts with the five before, per level', () => {
    // Twelve from-memory attempts, one a day: the oldest two fall outside both windows.
    const scores = [10, 20, 30, 40, 50, 60, 70, 80, 90, 95, 98, 100];
    const attempts = scores.map((score, i) => attempt({ score, finishedAt: day(i + 1) }));
    const [trend] = levelTrends(attempts);
    // Latest five: 80, 90, 95, 98, 100 → 92.6; the five before: 30, 40, 50, 60, 70 → 50.
    expect(trend).toEqual({
      level: 'from_memory',
      finished: 12,
      recent: 92.6,
      before: 50,
      change: 42.6,
    });
  });

  it('orders by when an attempt finished, not by the order given', () => {
    const late = attempt({ score: 100, finishedAt: day(20) });
    const early = attempt({ score: 0, finishedAt: day(2) });
    const trend = levelTrends([late, early], 1)[0]!;
    expect(trend.recent).toBe(100);
    expect(trend.before).toBe(0);
  });

  it('leaves out unfinished attempts and levels never finished; no comparison with five or fewer', () => {
    const trends = levelTrends([
      attempt({ score: 80, level: 'guided' }),
      attempt({ score: null, finishedAt: null, level: 'wrench_setup' }),
    ]);
    expect(trends).toEqual([
      { level: 'guided', finished: 1, recent: 80, before: null, change: null },
    ]);
  });
});

describe('scoreSeries', () => {
  it('draws one line per person and level, oldest point first, finished attempts only', () => {
    const series = scoreSeries([
      attempt({
        userId: 'u2',
        personName: 'Bo Learner',
        level: 'guided',
        score: 70,
        finishedAt: day(3),
      }),
      attempt({ score: 60, finishedAt: day(5) }),
      attempt({ score: 40, finishedAt: day(4) }),
      attempt({ score: null, finishedAt: null }),
    ]);
    expect(series.map((s) => s.label)).toEqual([
      'Ada Apprentice — From memory',
      'Bo Learner — Guided',
    ]);
    expect(series[0]!.points.map((p) => p.score)).toEqual([40, 60]);
    expect(series[1]!.points).toEqual([
      { attemptId: expect.any(String), at: day(3).getTime(), score: 70 },
    ]);
  });
});
