import type { PracticeLevel } from './types';

/**
 * Progress from finished attempts, pure: the trend per level (the latest few against the few
 * before) and the series the lead's chart and its table show. No I/O, so both are unit-tested.
 */
export const LEVEL_NAMES: Record<PracticeLevel, string> = {
  guided: 'Guided',
  from_memory: 'From memory',
  wrench_setup: 'Wrench setup',
};

export type ProgressAttempt = {
  id: string;
  userId: string;
  personName: string;
  level: PracticeLevel;
  source: 'spec' | 'surprise';
  ringName: string;
  startedAt: Date;
  finishedAt: Date | null;
  score: number | null;
};

type Finished = ProgressAttempt & { finishedAt: Date; score: number };

export function finishedOldestFirst(attempts: readonly ProgressAttempt[]): Finished[] {
  return attempts
    .filter((a): a is Finished => a.finishedAt !== null && a.score !== null)
    .sort((x, y) => x.finishedAt.getTime() - y.finishedAt.getTime() || x.id.localeCompare(y.id));
}

const mean = (xs: number[]) =>
  xs.length ? Math.round((xs.reduce((s, x) => s + x, 0) / xs.length) * 10) / 10 : null;

export type LevelTrend = {
  level: PracticeLevel;
  finished: number;
  /** Mean score of the latest `window` finished attempts at this level. */
  recent: number | null;
  /** Mean score of the `window` before those; null until there are more than `window`. */
  before: number | null;
  /** recent − before, in points; null without both. */
  change: number | null;
};

/** One person's trend per level they practised (levels with no finished attempt are left out). */
export function levelTrends(attempts: readonly ProgressAttempt[], window = 5): LevelTrend[] {
  const done = finishedOldestFirst(attempts);
  const levels = Object.keys(LEVEL_NAMES) as PracticeLevel[];
  return levels.flatMap((level) => {
    const scores = done.filter((a) => a.level === level).map((a) => a.score);
    if (scores.length === 0) return [];
    const recent = mean(scores.slice(-window));
    const before = mean(scores.slice(-2 * window, -window));
    const change =
      recent !== null && before !== null ? Math.round((recent - before) * 10) / 10 : null;
    return [{ level, finished: scores.length, recent, before, change }];
  });
}

export type ScoreSeries = {
  key: string;
  label: string;
  points: { attemptId: string; at: number; score: number }[];
};

/** One line per person and level, oldest point first: what the chart draws and the table lists. */
export function scoreSeries(attempts: readonly ProgressAttempt[]): ScoreSeries[] {
  const byKey = new Map<string, ScoreSeries>();
  for (const a of finishedOldestFirst(attempts)) {
    const key = `${a.userId}:${a.level}`;
    let series = byKey.get(key);
    if (!series) {
      series = { key, label: `${a.personName} — ${LEVEL_NAMES[a.level]}`, points: [] };
      byKey.set(key, series);
    }
    series.points.push({ attemptId: a.id, at: a.finishedAt.getTime(), score: a.score });
  }
  return [...byKey.values()].sort((x, y) => x.label.localeCompare(y.label));
}
