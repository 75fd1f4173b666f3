import Link from 'next/link';
import { formatTorque } from '@/features/torque-plan';
import { EmptyState } from '@/features/ui/page';
import type { Spec } from '../server/specs';

const PATTERN: Record<Spec['patternKind'], string> = { cross: 'cross', skip: 'skip', sequential: 'sequential' };

export function SpecList({ specs, canManage }: { specs: Spec[]; canManage: boolean }) {
  if (specs.length === 0) {
    return (
      <EmptyState title="No wheel specs yet">
        {canManage ? 'Create the first spec from the wheel maker’s torque figures; job cards pick their wheels from these.' : 'A lead sets up the shop’s wheel specs.'}
      </EmptyState>
    );
  }
  return (
    <ul className="divide-y-2 divide-paper-line rounded-xl border-2 border-paper-line">
      {specs.map((s) => (
        <li key={s.id}>
          <Link href={`/specs/${s.id}`} className="flex min-h-touch flex-col p-3 hover:bg-paper-dim">
            <span className="font-semibold text-work underline">{s.name}</span>
            <span className="text-ink-soft">
              {s.boltCount} bolts {s.boltThread} · {formatTorque({ value: s.finalTorque, unit: s.torqueUnit }, 2)} · {PATTERN[s.patternKind]}
              {s.patternKind === 'skip' ? ` ${s.skipStep}` : ''} · passes {s.passPercents.join('/')} %
            </span>
            {s.plausibilityFlag ? (
              <span className="mt-1 rounded border-l-4 border-danger bg-danger-tint p-2 text-danger">
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
