'use client';

import { useCallback, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { Bolt, R } from './bolt';
import { boltLabel, boltPosition, type BoltState } from './geometry';

type Props = {
  /** Bolts on the ring, 4 to 64. */
  count: number;
  /** This pass's tightening order (bolt numbers); omitted in hand-start mode. */
  order?: number[];
  /** Bolts confirmed in this pass, or started by hand in hand-start mode. */
  done: readonly number[];
  /** The bolt to tighten next (highlighted). */
  next?: number | null;
  mode?: 'pass' | 'hand-start' | 'preview';
  passLabel?: string;
  selected?: number | null;
  onSelect?: (bolt: number) => void;
  /** Accessible name of the whole circle. */
  label: string;
  /** Bolts to mark (a dashed ring and "out of order" in words), e.g. on a review of the order confirmed. */
  marked?: readonly number[];
  /** Bolts with a problem flagged (stripped, snapped…): a red cross and "problem flagged" in words. */
  flagged?: readonly number[];
};

/** Turn numbers drawn only for the next few bolts, so a turn is never read as a bolt number. */
export const TURNS_SHOWN = 4;

/** From this many bolts the circle's tap targets fall under 44 px on a 360 px phone: a list takes the taps. */
export const LIST_FROM = 32;

/**
 * The ring seen from outside: the valve notch at the top, bolts numbered clockwise from it. Each
 * bolt says its state in words (screen readers), in shape (check, ring, number) and in colour.
 * Arrow keys move between bolts; Enter or Space selects one for correction or undo.
 */
export function BoltCircle({
  count,
  order,
  done,
  next = null,
  mode = 'pass',
  passLabel = 'this pass',
  selected = null,
  onSelect,
  label,
  marked,
  flagged,
}: Props) {
  const doneSet = useMemo(() => new Set(done), [done]);
  const step = useMemo(() => new Map((order ?? []).map((b, i) => [b, i + 1])), [order]);
  const [focus, setFocus] = useState<number>(next ?? 1);
  const refs = useRef<(SVGGElement | null)[]>([]);
  const bolts = Array.from({ length: count }, (_, i) => i + 1);
  const size = count > 40 ? 7 : count > 24 ? 9 : 11;
  // Big rings: bolts are drawn, not tapped; BoltList below the ring takes the taps.
  const interactive = Boolean(onSelect) && count < LIST_FROM;
  const nextTurn = next ? step.get(next) : undefined;
  const turnShown = (n: number | undefined) =>
    n !== undefined && nextTurn !== undefined && n >= nextTurn && n < nextTurn + TURNS_SHOWN;

  const stateOf = (b: number): BoltState =>
    mode === 'hand-start'
      ? doneSet.has(b)
        ? 'started'
        : 'not-started'
      : doneSet.has(b)
        ? 'done'
        : b === next
          ? 'next'
          : 'pending';

  // The latest onSelect behind one function that never changes, so the bolts' memo holds.
  const onSelectRef = useRef(onSelect);
  useLayoutEffect(() => {
    onSelectRef.current = onSelect;
  });
  const select = useCallback((b: number) => onSelectRef.current?.(b), []);
  const register = useCallback((b: number, el: SVGGElement | null) => {
    refs.current[b] = el;
  }, []);
  const move = useCallback(
    (e: KeyboardEvent<SVGGElement>, b: number) => {
      const keys: Record<string, number> = {
        ArrowRight: 1,
        ArrowDown: 1,
        ArrowLeft: -1,
        ArrowUp: -1,
      };
      if (e.key in keys) {
        e.preventDefault();
        const to = ((b - 1 + keys[e.key]! + count) % count) + 1;
        setFocus(to);
        refs.current[to]?.focus();
      } else if (e.key === 'Home' || e.key === 'End') {
        e.preventDefault();
        const to = e.key === 'Home' ? 1 : count;
        setFocus(to);
        refs.current[to]?.focus();
      } else if ((e.key === 'Enter' || e.key === ' ') && onSelectRef.current) {
        e.preventDefault();
        select(b);
      }
    },
    [count, select],
  );

  return (
    <svg
      viewBox="-110 -110 220 220"
      role="group"
      aria-label={label}
      className="mx-auto block aspect-square w-full max-w-md touch-manipulation select-none"
    >
      <circle r={R} fill="none" stroke="#3b424b" strokeWidth={3} />
      <circle r={R - 22} fill="#f2f4f6" stroke="#c9ced4" strokeWidth={2} />
      {/* The valve notch: a gap in the ring and a stem below it. */}
      <g aria-hidden>
        <rect x={-6} y={-R - 8} width={12} height={16} fill="#ffffff" />
        <path
          d={`M -6 ${-R - 8} L 0 ${-R + 4} L 6 ${-R - 8} Z`}
          fill="#ffb300"
          stroke="#101317"
          strokeWidth={1.5}
        />
        <text y={-R + 22} textAnchor="middle" fontSize={9} fontWeight={700} fill="#101317">
          VALVE
        </text>
      </g>
      {bolts.map((b) => {
        const state = stateOf(b);
        // Hand-start: the suggested next bolt gets the highlight ring, its state stays in words.
        const suggested = mode === 'hand-start' && b === next;
        const isMarked = marked?.includes(b) ?? false;
        const isFlagged = flagged?.includes(b) ?? false;
        return (
          <Bolt
            key={b}
            bolt={b}
            count={count}
            size={size}
            state={state}
            label={`${boltLabel(b, state, passLabel, step.get(b))}${isMarked ? ', out of order' : ''}${suggested ? ', start this one next' : ''}${isFlagged ? ', problem flagged' : ''}`}
            interactive={interactive}
            tabbable={b === focus}
            selected={selected === b}
            highlighted={state === 'next' || suggested}
            marked={isMarked}
            flagged={isFlagged}
            onSelect={select}
            onKey={move}
            onFocus={setFocus}
            register={register}
          />
        );
      })}
      {/* Turn numbers are drawn on the bolts but outside their buttons, so a bolt button's only
          visible text is its own number, which its name starts with: a voice-control user says
          the number they see (WCAG 2.5.3). Taps pass through to the bolt underneath. */}
      <g aria-hidden pointerEvents="none">
        {bolts.map((b) => {
          const n = step.get(b);
          const state = stateOf(b);
          if (!n || mode === 'hand-start' || state === 'done' || state === 'started') return null;
          if (mode !== 'preview' && !turnShown(n)) return null;
          const { x, y } = boltPosition(b, count, R);
          return (
            <text
              key={b}
              x={x}
              y={y}
              dy="0.35em"
              textAnchor="middle"
              fontSize={size * 0.95}
              fontWeight={700}
              fill={state === 'next' ? '#ffffff' : '#101317'}
              data-turn={b}
            >
              {n}
            </text>
          );
        })}
      </g>
      {next && mode === 'pass' ? (
        <text y={6} textAnchor="middle" fontSize={26} fontWeight={800} fill="#101317" aria-hidden>
          {next}
        </text>
      ) : null}
    </svg>
  );
}
