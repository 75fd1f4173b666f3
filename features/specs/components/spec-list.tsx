import Link from 'next/link';
import { formatTorque } from '@/features/torque-plan';
import { EmptyState } from '@/features/ui/page';
import type { Spec } from '../server/specs';

const PATTERN: Record<Spec['patternKind'], string> = {
  cross: 'cross',
  skip: 'skip',
  sequential: 'sequential',
};

export function SpecList({ specs, canManage }: { specs: Spec[]; canManage: boolean }) {
  if (specs.length === 0) {
    return (
      <EmptyState title="No wheel specs yet">
        {canManage
          ? 'Create the first spec from the wheel maker’s torque figures; job cards pick their wheels from these.'
          : 'A lead sets up the shop’s wheel specs.'}
      </EmptyState>
    );
  }
  return (
    <ul className="divide-paper-line border-paper-line divide-y-2 rounded-xl border-2">
      {specs.map((s) => (
        <li key={s.id}>
          <Link
            href={`/specs/${s.id}`}
            className="min-h-touch hover:bg-paper-dim flex flex-col p-3"
          >
            <span className="text-work font-semibold underline">{s.name}</span>
            <span className="text-ink-soft">
              {s.boltCount} bolts {s.boltThread} ·{' '}
              {formatTorque({ value: s.finalTorque, unit: s.torqueUnit }, 2)} ·{' '}
              {PATTERN[s.patternKind]}
              {s.patternKind === 'skip' ? ` ${s.skipStep}` : ''} · passes {s.passPercents.join('/')}{' '}
              %
            </span>
            {s.plausibilityFlag ? (
              <span className="border-danger bg-danger-tint text-danger mt-1 rounded border-l-4 p-2">
                <span className="font-bold">Flagged, runner blocked: </span>
                {s.plausibilityFlag}
              </span>
            ) : null}
          </Link>
        </li>
      ))}
    </ul>
  );
}
