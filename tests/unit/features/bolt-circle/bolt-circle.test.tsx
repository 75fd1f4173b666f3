// @vitest-environment jsdom
import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import { boltPosition } from '@/features/bolt-circle/geometry';
import { tighteningSequence } from '@/features/torque-plan';

describe('BoltCircle', () => {
  it('draws N bolts, each labelled with its number, the pass and its state', () => {
    render(
      <BoltCircle
        count={24}
        order={tighteningSequence(24, { kind: 'cross' })}
        done={[1, 13]}
        next={7}
        passLabel="pass 2"
        label="Pass 2"
        onSelect={() => {}}
      />,
    );
    const bolts = screen.getAllByRole('button');
    expect(bolts).toHaveLength(24);
    expect(screen.getByRole('button', { name: 'bolt 1, pass 2, done' })).toBeInTheDocument();
    expect(
      screen.getByRole('button', { name: 'bolt 7, pass 2, next, 3rd in order' }),
    ).toBeInTheDocument();
    expect(
      screen.getByRole('button', { name: 'bolt 19, pass 2, to do, 4th in order' }),
    ).toBeInTheDocument();
  });

  it('the highlight follows the sequence as bolts are confirmed', () => {
    const order = tighteningSequence(8, { kind: 'cross' });
    function Pass() {
      const [done, setDone] = useState<number[]>([]);
      const next = order.find((b) => !done.includes(b)) ?? null;
      return (
        <>
          <BoltCircle count={8} order={order} done={done} next={next} label="Pass 1" />
          <button type="button" onClick={() => next && setDone([...done, next])}>
            Clicked — next bolt
          </button>
        </>
      );
    }
    render(<Pass />);
    const nextBolt = () =>
      screen
        .getAllByRole('img')
        .find((el) => el.getAttribute('data-state') === 'next')
        ?.getAttribute('aria-label');
    const seen: (string | null | undefined)[] = [];
    for (let i = 0; i < 8; i++) {
      seen.push(nextBolt());
      fireEvent.click(screen.getByRole('button', { name: 'Clicked — next bolt' }));
    }
    expect(seen.map((l) => Number(/bolt (\d+)/.exec(l ?? '')?.[1]))).toEqual(order);
  });

  it('works from the keyboard: one tab stop, arrows go round, Enter selects', async () => {
    const onSelect = vi.fn();
    render(
      <BoltCircle
        count={12}
        order={tighteningSequence(12, { kind: 'cross' })}
        done={[]}
        next={1}
        label="Pass 1"
        onSelect={onSelect}
      />,
    );
    await userEvent.tab();
    expect(document.activeElement).toHaveAccessibleName(/^bolt 1,/);
    await userEvent.keyboard('{ArrowRight}{ArrowRight}');
    expect(document.activeElement).toHaveAccessibleName(/^bolt 3,/);
    await userEvent.keyboard('{ArrowLeft}{ArrowLeft}{ArrowLeft}');
    expect(document.activeElement).toHaveAccessibleName(/^bolt 12,/);
    await userEvent.keyboard('{Enter}');
    expect(onSelect).toHaveBeenCalledWith(12);
    expect(
      screen.getAllByRole('button').filter((b) => b.getAttribute('tabindex') === '0'),
    ).toHaveLength(1);
  });

  it('hand-start mode says which bolts are started, not by colour alone', () => {
    render(<BoltCircle count={6} done={[2, 5]} mode="hand-start" label="Hand-start" />);
    expect(screen.getByRole('img', { name: 'bolt 2, started by hand' })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: 'bolt 3, not started yet' })).toBeInTheDocument();
  });
});

describe('bolt positions', () => {
  it('a confirmation changes the two bolts in place: no element of a bolt is added or removed', async () => {
    const order = tighteningSequence(8, { kind: 'cross' });
    const ring = (done: number[]) => (
      <BoltCircle
        count={8}
        order={order}
        done={done}
        next={order[done.length]}
        label="Pass 1"
        onSelect={() => {}}
      />
    );
    const { rerender } = render(ring([]));
    const added: Node[] = [];
    const removed: Node[] = [];
    const seen = new MutationObserver((records) => {
      for (const r of records) {
        added.push(...r.addedNodes);
        removed.push(...r.removedNodes);
      }
    });
    for (const bolt of screen.getAllByRole('button'))
      seen.observe(bolt, { childList: true, subtree: true });
    rerender(ring([order[0]!]));
    await Promise.resolve(); // mutation records are delivered in a microtask
    seen.disconnect();
    expect(screen.getByRole('button', { name: /^bolt 1,.*done/ })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /next/ })).toHaveAccessibleName(/^bolt 5,/);
    expect([added.length, removed.length]).toEqual([0, 0]);
  });

  it('bolt 1 sits just clockwise of the valve notch at 12 o’clock, and they go round clockwise', () => {
    const one = boltPosition(1, 8, 100);
    const two = boltPosition(2, 8, 100);
    expect(one.x).toBeGreaterThan(0);
    expect(one.y).toBeLessThan(-90);
    expect(two.x).toBeGreaterThan(one.x);
    expect(boltPosition(8, 8, 100).x).toBeCloseTo(-one.x, 9);
  });
});

describe('BoltCircle for voice control (WCAG 2.5.3, label in name)', () => {
  /** The words drawn inside an element (hidden from screen readers or not), in document order. */
  const drawnWords = (el: Element) =>
    [...el.querySelectorAll('text')].flatMap((t) => (t.textContent ?? '').split(/\s+/));
  const words = (name: string) =>
    name
      .toLowerCase()
      .split(/[^a-z0-9]+/)
      .filter(Boolean);
  const containsInOrder = (name: string[], drawn: string[]) =>
    name.some((_, i) => drawn.every((w, j) => name[i + j] === w));

  it.each([
    ['a pass with turn numbers shown on the next bolts', { done: [1], next: 5 }],
    ['a pass at its start', { done: [], next: 1 }],
  ])('%s: each bolt button shows only words its name holds, in order', (_, { done, next }) => {
    render(
      <BoltCircle
        count={8}
        order={tighteningSequence(8, { kind: 'cross' })}
        done={done}
        next={next}
        passLabel="pass 1"
        label="Pass 1"
        onSelect={() => {}}
      />,
    );
    const bolts = screen.getAllByRole('button');
    expect(bolts).toHaveLength(8);
    for (const bolt of bolts) {
      const name = bolt.getAttribute('aria-label') ?? '';
      expect(drawnWords(bolt), name).toEqual([/bolt (\d+)/.exec(name)![1]]);
      expect(containsInOrder(words(name), drawnWords(bolt)), name).toBe(true);
    }
    // The turn numbers are still drawn, on the ring, for the next few bolts.
    expect(document.querySelectorAll('[data-turn]').length).toBeGreaterThan(0);
  });

  it('hand-start: each bolt button shows its own number, which its name holds', () => {
    render(
      <BoltCircle
        count={8}
        done={[1, 2]}
        next={3}
        mode="hand-start"
        label="Hand-start"
        onSelect={() => {}}
      />,
    );
    for (const bolt of screen.getAllByRole('button')) {
      const name = bolt.getAttribute('aria-label') ?? '';
      expect(containsInOrder(words(name), drawnWords(bolt)), name).toBe(true);
    }
  });
});
