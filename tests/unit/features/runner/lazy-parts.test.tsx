// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { onDemand } from '@/features/runner/components/lazy-parts';

describe('a runner part loaded when its step opens', () => {
  it('holds its place with a status line while it loads, then shows the part', async () => {
    let arrive: (c: () => React.JSX.Element) => void = () => {};
    const Part = onDemand(
      () => new Promise<() => React.JSX.Element>((resolve) => (arrive = resolve)),
      'the summary',
      'min-h-96',
    );
    render(<Part />);
    const waiting = screen.getByRole('status');
    expect(waiting).toHaveTextContent('Loading the summary…');
    // The box keeps about the part's height, so what is below it does not jump when it lands.
    expect(waiting).toHaveClass('min-h-96');
    arrive(() => <p>Wheel summary</p>);
    expect(await screen.findByText('Wheel summary')).toBeInTheDocument();
    expect(screen.queryByRole('status')).toBeNull();
  });

  it('offline, never opened before: says it needs the Wi-Fi once and offers to try again, instead of the error page', async () => {
    const Part = onDemand(
      () => Promise.reject(new TypeError('Failed to fetch dynamically imported module')),
      'the photo slots',
      'min-h-96',
    );
    render(<Part />);
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'This phone could not load the photo slots: it needs the Wi-Fi once.',
    );
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  });
});
