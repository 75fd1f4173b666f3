// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { BoardFilters } from '@/features/jobs/components/board-filters';

function screenWidth(wide: boolean) {
  vi.stubGlobal('matchMedia', (query: string) => ({
    matches: wide,
    media: query,
    addEventListener: vi.fn(),
    removeEventListener: vi.fn(),
  }));
}

afterEach(() => vi.unstubAllGlobals());

const show = () =>
  render(<BoardFilters filters={{ assignee: 'me' }} people={[]} onChange={vi.fn()} />);

describe('the board filters', () => {
  it('fold behind one Filter button on a phone, which opens them and says so', async () => {
    screenWidth(false);
    show();
    const button = screen.getByRole('button', { name: /^Filter/ });
    expect(button).toHaveAttribute('aria-expanded', 'false');
    const panel = document.getElementById(button.getAttribute('aria-controls')!)!;
    expect(panel).toHaveAccessibleName('Filter the board');
    expect(panel).toHaveClass('hidden');
    await userEvent.click(button);
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).not.toHaveClass('hidden');
    expect(screen.getByLabelText('Assigned to')).toHaveValue('me');
  });

  it('are open on a wide screen and can be folded; the button counts the filters in use', async () => {
    screenWidth(true);
    show();
    const button = screen.getByRole('button', { name: 'Filter (1 on)' });
    expect(button).toHaveAttribute('aria-expanded', 'true');
    await userEvent.click(button);
    expect(button).toHaveAttribute('aria-expanded', 'false');
  });
});
