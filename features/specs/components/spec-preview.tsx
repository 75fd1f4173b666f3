import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import { formatTorque, planTorque, UNIT_LABELS, type Wrench } from '@/features/torque-plan';
import { specPattern } from '../engine-check';
import type { SpecInput } from '../schemas';

export type CribWrench = Wrench & { label: string };

/**
 * What each pass of this spec will use with the shop's in-service wrenches, as the engine plans it
 * under the shop's wrench floor (`minFractionOfMax`, a fraction of each wrench's maximum).
 */
export function SpecPreview({
  spec,
  wrenches,
  minFractionOfMax,
}: {
  spec: SpecInput;
  wrenches: CribWrench[];
  minFractionOfMax: number;
}) {
  const plan = planTorque({
    boltCount: spec.boltCount,
    pattern: specPattern(spec),
    final: { value: spec.finalTorque, unit: spec.torqueUnit },
    fractions: spec.passPercents.map((p) => p / 100),
    checkPass: spec.checkPass,
    wrenches,
    minFractionOfMax,
  });
  const label = (id: string) => wrenches.find((w) => w.id === id)?.label ?? id;
  return (
    <section aria-labelledby="preview-heading" className="flex flex-col gap-3">
      <h2 id="preview-heading" className="text-xl font-bold">
        Plan preview
      </h2>
      <p>
        <span className="font-semibold">
          Sequence ({spec.boltCount} bolts, numbered clockwise from the first bolt past the valve
          notch):
        </span>{' '}
        <span className="font-mono">{plan.sequence.join(' · ')}</span>
      </p>
      <div className="max-w-xs">
        <BoltCircle
          count={spec.boltCount}
          order={plan.sequence}
          done={[]}
          next={plan.sequence[0]}
          mode="preview"
          label={`Tightening order on a ${spec.boltCount}-bolt ring`}
        />
      </div>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Passes with the wrench and setting for each</caption>
          <thead>
            <tr className="border-ink border-b-2">
              <th scope="col" className="p-2">
                Pass
              </th>
              <th scope="col" className="p-2">
                Target
              </th>
              <th scope="col" className="p-2">
                Wrench and setting
              </th>
            </tr>
          </thead>
          <tbody>
            {plan.passes.map((p) => (
              <tr key={p.index} className="border-paper-line border-b align-top">
                <th scope="row" className="p-2 font-semibold">
                  {p.kind === 'check'
                    ? 'Check pass'
                    : `Pass ${p.index} (${Math.round(p.fraction * 100)} %)`}
                </th>
                <td className="p-2">{formatTorque(p.target, 2)}</td>
                <td className="p-2">
                  {p.wrench.ok ? (
                    <>
                      <span className="font-semibold">{label(p.wrench.wrenchId)}</span> set to{' '}
                      <span className="font-semibold">
                        {p.wrench.setting.value} {UNIT_LABELS[p.wrench.setting.unit]}
                      </span>
                      {p.wrench.warnings.map((w) => (
                        <p
                          key={w}
                          className="border-caution bg-caution-tint text-caution-ink mt-1 rounded border-l-4 p-2"
                        >
                          <span className="font-bold">Warning: </span>
                          {w}
                        </p>
                      ))}
                    </>
                  ) : (
                    <p className="border-danger bg-danger-tint text-danger rounded border-l-4 p-2">
                      <span className="font-bold">No wrench: </span>
                      {p.wrench.reason}
                    </p>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-ink-soft text-sm">
        The engine plans from what you entered. The wheel maker&apos;s torque spec and sequence come
        first; never use a computed value in place of it.
      </p>
    </section>
  );
}
