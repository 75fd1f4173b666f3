// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import AuthError from '@/app/(auth)/error';
import RunnerError from '@/app/(runner)/error';
import ShopError from '@/app/(shop)/error';

function thrown() {
  const error = new Error(
    'relation "jobs" does not exist at postgres://ringpass:secret@db/ringpass',
  ) as Error & { digest?: string };
  error.digest = '2417738913';
  error.stack =
    'Error: relation "jobs" does not exist\n    at listBoard (features/jobs/server/board.ts:88:11)';
  return error;
}

describe.each([
  ['shop', ShopError],
  ['runner', RunnerError],
  ['sign-in', AuthError],
])('the %s pages’ error boundary', (_, Boundary) => {
  it('says the page could not be shown, gives the reference to quote and a retry, and never the message or stack', async () => {
    const retry = vi.fn();
    const { container } = render(<Boundary error={thrown()} retry={retry} reset={vi.fn()} />);
    // The runner's boundary fetches RouteError when it shows (kept out of the first load): await it.
    expect(await screen.findByRole('alert')).toHaveTextContent('This page could not be shown');
    expect(screen.getByText('2417738913')).toBeInTheDocument();
    expect(container.textContent).not.toMatch(/relation|postgres|secret|board\.ts|at listBoard/);
    await userEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(retry).toHaveBeenCalledTimes(1);
  });
});

it('falls back to reset when the framework gives no retry, and shows no reference line without a digest', async () => {
  const reset = vi.fn();
  render(<ShopError error={new Error('boom')} reset={reset} />);
  expect(screen.queryByText(/Reference/)).toBeNull();
  await userEvent.click(screen.getByRole('button', { name: 'Try again' }));
  expect(reset).toHaveBeenCalledTimes(1);
});
