// @vitest-environment jsdom
// The runner's error boundary fetches RouteError only when an error shows. Offline on a first
// visit that fetch fails, and React.lazy keeps the failure: the boundary must still say what
// happened and offer a retry rather than show nothing.
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, it, vi } from 'vitest';
import RunnerError from '@/app/(runner)/error';

const loads = vi.hoisted(() => ({ count: 0 }));
vi.mock('@/features/ui/route-error', () => {
  loads.count++;
  throw new TypeError('Failed to fetch dynamically imported module');
});

it('when RouteError cannot be fetched, the runner still shows the error, its reference and Try again', async () => {
  const error = Object.assign(new Error('boom'), { digest: '2417738913' });
  const retry = vi.fn();
  render(<RunnerError error={error} retry={retry} />);
  // Past every try of the loader (3, 0.5 s apart): still a message, never an empty page.
  await vi.waitFor(() => expect(loads.count).toBeGreaterThanOrEqual(1));
  await new Promise((resolve) => setTimeout(resolve, 1_500));
  expect(await screen.findByRole('alert')).toHaveTextContent('This page could not be shown');
  expect(screen.getByText('2417738913')).toBeInTheDocument();
  await userEvent.click(screen.getByRole('button', { name: 'Try again' }));
  expect(retry).toHaveBeenCalledTimes(1);
  // Each try fetched again (React.lazy would have kept the first failure).
  expect(loads.count).toBe(3);
});
