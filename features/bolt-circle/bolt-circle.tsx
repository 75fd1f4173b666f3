'use client';

import { useMemo, useRef, useState, type KeyboardEvent } from 'react';
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

const R = 88;

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

  function move(e: KeyboardEvent<SVGGElement>, b: number) {
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
    } else if ((e.key === 'Enter' || e.key === ' ') && onSelect) {
      e.preventDefault();
      onSelect(b);
    }
  }

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
        const { x, y } = boltPosition(b, count, R);
        const out = boltPosition(b, count, R + size + 8);
        const state = stateOf(b);
        const isDone = state === 'done' || state === 'started';
        const isNext = state === 'next';
        // Hand-start: the suggested next bolt gets the highlight ring, its state stays in words.
        const suggested = mode === 'hand-start' && b === next;
        const n = step.get(b);
        return (
          <g
            key={b}
            ref={(el) => {
              refs.current[b] = el;
            }}
            role={interactive ? 'button' : 'img'}
            aria-label={`${boltLabel(b, state, passLabel, n)}${marked?.includes(b) ? ', out of order' : ''}${suggested ? ', start this one next' : ''}${flagged?.includes(b) ? ', problem flagged' : ''}`}
            aria-pressed={interactive ? selected === b : undefined}
            tabIndex={interactive ? (b === focus ? 0 : -1) : undefined}
            onClick={interactive ? () => onSelect?.(b) : undefined}
            onKeyDown={interactive ? (e) => move(e, b) : undefined}
            onFocus={() => setFocus(b)}
            className={
              interactive
                ? 'cursor-pointer outline-none [&:focus-visible>.focus]:stroke-[#0a4f8a]'
                : undefined
            }
            data-state={state}
          >
            <circle
              className="focus"
              cx={x}
              cy={y}
              r={size + 5}
              fill="none"
              stroke={selected === b ? '#101317' : 'transparent'}
              strokeWidth={2.5}
              strokeDasharray={selected === b ? '3 2' : undefined}
            />
            {isNext || suggested ? (
              <circle cx={x} cy={y} r={size + 3} fill="none" stroke="#0a4f8a" strokeWidth={3} />
            ) : null}
            {marked?.includes(b) ? (
              <circle
                cx={x}
                cy={y}
                r={size + 4}
                fill="none"
                stroke="#b3261e"
                strokeWidth={3}
                strokeDasharray="4 2"
                data-marked
              />
            ) : null}
            <circle
              cx={x}
              cy={y}
              r={size}
              fill={isDone ? '#1d6b36' : isNext ? '#0a4f8a' : '#ffffff'}
              stroke="#101317"
              strokeWidth={1.5}
            />
            {isDone ? (
              <path
                d={`M ${x - size / 2} ${y} l ${size / 3} ${size / 3} l ${size / 1.6} ${-size / 1.4}`}
                fill="none"
                stroke="#ffffff"
                strokeWidth={2}
                aria-hidden
              />
            ) : null}
            {flagged?.includes(b) ? (
              <g data-flagged aria-hidden>
                <circle cx={x} cy={y} r={size + 4} fill="none" stroke="#b3261e" strokeWidth={3.5} />
                <path
                  d={`M ${x - size} ${y - size} L ${x + size} ${y + size} M ${x + size} ${y - size} L ${x - size} ${y + size}`}
                  stroke="#b3261e"
                  strokeWidth={3}
                />
              </g>
            ) : null}
            <text
              x={out.x}
              y={out.y}
              dy="0.35em"
              textAnchor="middle"
              fontSize={size * 0.8}
              fill="#3b424b"
              aria-hidden
            >
              {b}
            </text>
          </g>
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
