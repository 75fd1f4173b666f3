'use client';

import { memo, type KeyboardEvent } from 'react';
import { boltPosition, type BoltState } from './geometry';

export const R = 88;

type Props = {
  bolt: number;
  count: number;
  size: number;
  state: BoltState;
  /** The whole accessible name, worked out by the circle. */
  label: string;
  interactive: boolean;
  /** The one bolt that takes Tab (roving focus). */
  tabbable: boolean;
  selected: boolean;
  /** The highlight ring: the next bolt, or the one to start by hand next. */
  highlighted: boolean;
  marked: boolean;
  flagged: boolean;
  // The handlers take the bolt, so the circle passes the same functions to every bolt on every
  // render and a tap redraws only the bolts whose state changed.
  onSelect: (bolt: number) => void;
  onKey: (e: KeyboardEvent<SVGGElement>, bolt: number) => void;
  onFocus: (bolt: number) => void;
  register: (bolt: number, el: SVGGElement | null) => void;
};

/** One bolt of the ring: its mark, state rings and number (see BoltCircle). */
export const Bolt = memo(function Bolt({
  bolt: b,
  count,
  size,
  state,
  label,
  interactive,
  tabbable,
  selected,
  highlighted,
  marked,
  flagged,
  onSelect,
  onKey,
  onFocus,
  register,
}: Props) {
  const { x, y } = boltPosition(b, count, R);
  const out = boltPosition(b, count, R + size + 8);
  const isDone = state === 'done' || state === 'started';
  const isNext = state === 'next';
  return (
    <g
      ref={(el) => register(b, el)}
      role={interactive ? 'button' : 'img'}
      aria-label={label}
      aria-pressed={interactive ? selected : undefined}
      tabIndex={interactive ? (tabbable ? 0 : -1) : undefined}
      onClick={interactive ? () => onSelect(b) : undefined}
      onKeyDown={interactive ? (e) => onKey(e, b) : undefined}
      onFocus={() => onFocus(b)}
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
        stroke={selected ? '#101317' : 'transparent'}
        strokeWidth={2.5}
        strokeDasharray={selected ? '3 2' : undefined}
      />
      {/* The highlight ring and the check are always drawn, shown or not by their stroke: a tap
          then changes two attributes instead of adding and removing elements, which costs the
          browser less in the tap's frame (no element made, no SVG layout). */}
      <circle
        cx={x}
        cy={y}
        r={size + 3}
        fill="none"
        stroke={highlighted ? '#0a4f8a' : 'none'}
        strokeWidth={3}
      />
      {marked ? (
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
      <path
        d={`M ${x - size / 2} ${y} l ${size / 3} ${size / 3} l ${size / 1.6} ${-size / 1.4}`}
        fill="none"
        stroke={isDone ? '#ffffff' : 'none'}
        strokeWidth={2}
        aria-hidden
      />
      {flagged ? (
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
});
