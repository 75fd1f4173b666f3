// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AttemptResult } from '@/features/practice/components/attempt-result';
import { scoreAttempt } from '@/features/practice/scoring';
import { attemptEvents, practiceSetup, swapAt } from '@/tests/helpers/practice-attempt';

const CROSS_12 = [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12];

describe('AttemptResult', () => {
  it('shows the score, how it is made up, the mistake in words and the pass done beside expected', () => {
    const setup = practiceSetup('from_memory');
    const result = scoreAttempt(
      setup,
      attemptEvents(setup, {
        passes: { 2: { order: swapAt(CROSS_12, 1) } },
        checklist: { safety: ['off-vehicle', 'deflated'] },
      }),
    );
    render(<AttemptResult setup={setup} result={result} />);

    expect(screen.getByRole('heading', { level: 2, name: 'Score: 90 out of 100' })).toBeVisible();
    const parts = within(screen.getByRole('table', { name: 'How the score is made up' }));
    expect(parts.getByRole('row', { name: 'Sequence 55 60' })).toBeVisible();
    expect(parts.getByRole('row', { name: 'Cautions and checks 20 25' })).toBeVisible();
    expect(parts.getByRole('row', { name: 'Completion 15 15' })).toBeVisible();
    expect(parts.getByRole('row', { name: 'Total 90 100' })).toBeVisible();

    const mistakes = within(screen.getByRole('list')).getAllByRole('listitem');
    expect(mistakes).toHaveLength(2);
    expect(mistakes[0]).toHaveTextContent(
      'Out of sequence (−5 points): Pass 2 (70 %, 21 ft-lb): bolt 4 was tightened when bolt 7 was next.',
    );
    expect(mistakes[0]).toHaveTextContent('Expected: bolt 7');
    expect(mistakes[1]).toHaveTextContent(
      'Skipped caution (−5 points): Safety gate was marked done without "The valve core is removed."',
    );

    // Only pass 2 is drawn; each circle has its name and each bolt its turn in words.
    const pass = screen.getByRole('region', { name: 'pass 2 (70 %, 21 ft-lb)' });
    const done = within(pass).getByRole('group', {
      name: 'pass 2 (70 %, 21 ft-lb): the order done',
    });
    expect(
      within(done).getByRole('img', {
        name: 'bolt 4, pass 2 (70 %, 21 ft-lb), as done, to do, 2nd in order, out of order',
      }),
    ).toBeInTheDocument();
    const expected = within(pass).getByRole('group', {
      name: 'pass 2 (70 %, 21 ft-lb): the order expected',
    });
    expect(
      within(expected).getByRole('img', {
        name: 'bolt 7, pass 2 (70 %, 21 ft-lb), expected, to do, 2nd in order',
      }),
    ).toBeInTheDocument();
    expect(pass).toHaveTextContent('Done (dashed: out of order): 1, 4, 7, 10');
    expect(pass).toHaveTextContent('Expected: 1, 7, 4, 10');
    expect(screen.queryByRole('region', { name: /pass 1 / })).toBeNull();

    const times = within(screen.getByRole('table', { name: 'Time on each step' }));
    expect(times.getByRole('row', { name: 'Safety gate 10 s' })).toBeVisible();
    // Role queries over two 12-bolt circles take a few seconds when the suite shares two cores.
  }, 30_000);

  it('says there were no mistakes on a perfect attempt and draws no pass', () => {
    const setup = practiceSetup('guided');
    render(<AttemptResult setup={setup} result={scoreAttempt(setup, attemptEvents(setup))} />);
    expect(screen.getByRole('heading', { name: 'Score: 100 out of 100' })).toBeVisible();
    expect(screen.getByText('None: every bolt in order, every check done.')).toBeVisible();
    expect(screen.queryByRole('group')).toBeNull();
  });
});
