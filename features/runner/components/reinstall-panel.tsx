'use client';

import { useMemo, useState } from 'react';
import {
  tighteningSequence,
  TORQUE_UNITS,
  UNIT_LABELS,
  type RecordedVerification,
  type Torque,
  type TorqueUnit,
} from '@/features/torque-plan';
import { UnitOptions } from '@/features/ui/unit-options';
import type { RunEvent } from '../events';
import type { Step } from '../steps';
import { passWrench, type CribWrench, type WrenchRules } from '../wrench-gate';
import { SettingCard } from './setting-card';
import { StepPanel } from './step-panel';
import { VerifyInline } from './verify-inline';

/** The star order for the lug nuts: the cross pattern over the lug count (any count the engine draws). */
function starOrder(lugCount: number | null): number[] | null {
  if (!lugCount) return null;
  try {
    return tighteningSequence(lugCount, { kind: 'cross' });
  } catch {
    return null;
  }
}

/**
 * Back on the vehicle: lug nuts in a star pattern, torqued with a wrench picked and checked like
 * a pass (the shop's floor and verification policy). Without a lug torque on the spec the
 * technician types the vehicle maker's value, and it is recorded with the step.
 */
export function ReinstallPanel({
  step,
  record,
  lug,
  wrenches,
  verifications,
  rules,
}: {
  step: Step;
  record: (e: RunEvent) => Promise<void>;
  lug: { torque: Torque | null; count: number | null };
  wrenches: CribWrench[];
  verifications: RecordedVerification[];
  rules: WrenchRules;
}) {
  const [fresh, setFresh] = useState<RecordedVerification[]>([]);
  const [failed, setFailed] = useState<string[]>([]);
  const [acked, setAcked] = useState(false);
  const [manual, setManual] = useState('');
  const [manualUnit, setManualUnit] = useState<TorqueUnit>('lbf-ft');
  const manualValue = manual.trim() ? Number(manual.replace(',', '.')) : null;
  const manualOk =
    manualValue !== null &&
    Number.isFinite(manualValue) &&
    manualValue > 0 &&
    manualValue <= 10_000;
  const target: Torque | null =
    lug.torque ?? (manualOk ? { value: manualValue, unit: manualUnit } : null);
  const all = useMemo(() => [...fresh, ...verifications], [fresh, verifications]);
  const gate = target
    ? passWrench({ target, wrenches, failed, rules, verifications: all, now: new Date() })
    : null;
  const order = starOrder(lug.count);

  let box: React.ReactNode = null;
  let blocked: string | undefined;
  if (!target) {
    blocked = "Type the lug torque from the vehicle's manual first.";
  } else if (!gate?.wrench || !gate.choice?.ok) {
    blocked = 'No in-service wrench suits the lug torque.';
    box = (
      <p role="alert" className="text-danger font-bold">
        {gate?.best && !gate.best.ok
          ? gate.best.reason
          : 'No in-service wrench suits the lug torque.'}
      </p>
    );
  } else if (gate.verification && !gate.verification.counts) {
    blocked = 'Verify the wrench first.';
    const w = gate.wrench;
    box = (
      <VerifyInline
        wrench={w}
        setting={gate.choice.setting}
        why={gate.verification.reason}
        onResult={(r) =>
          r.withinTolerance ? setFresh((v) => [r, ...v]) : setFailed((f) => [...f, w.id])
        }
      />
    );
  } else if (!acked) {
    blocked = 'Set the wrench first.';
    box = (
      <SettingCard
        passName={`Lug nuts: ${target.value} ${UNIT_LABELS[target.unit]}`}
        wrench={gate.wrench.label}
        setting={`${gate.choice.setting.value} ${UNIT_LABELS[gate.choice.setting.unit]}`}
        warnings={gate.choice.warnings}
        onSet={() => setAcked(true)}
      />
    );
  } else {
    box = (
      <p
        aria-label="Current setting"
        className="bg-work-tint text-work-dark rounded-lg px-2 py-1 text-center text-lg font-black"
      >
        Set {gate.wrench.label} to {gate.choice.setting.value}{' '}
        {UNIT_LABELS[gate.choice.setting.unit]}
      </p>
    );
  }

  return (
    <StepPanel
      step={step}
      record={record}
      readingUnit="psi"
      blocked={blocked}
      extraChecked={!lug.torque && manualOk ? [`lug-manual:${manualValue} ${manualUnit}`] : []}
      extra={
        <div className="flex flex-col gap-3">
          {lug.torque ? (
            <p className="text-lg">
              Lug-nut torque:{' '}
              <strong>
                {lug.torque.value} {UNIT_LABELS[lug.torque.unit]}
              </strong>
            </p>
          ) : (
            <div className="border-caution bg-caution-tint text-caution-ink flex flex-col gap-1 rounded-xl border-2 p-3">
              <p className="font-bold">
                This wheel&apos;s spec has no lug-nut torque. Take it from the vehicle&apos;s
                manual.
              </p>
              <label htmlFor="lug-manual" className="font-semibold">
                Lug torque from the vehicle&apos;s manual
              </label>
              <div className="grid grid-cols-[2fr_1fr] gap-2">
                <input
                  id="lug-manual"
                  inputMode="decimal"
                  value={manual}
                  onChange={(e) => setManual(e.target.value)}
                  className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 bg-white px-3 text-xl"
                />
                <select
                  aria-label="Torque unit"
                  value={manualUnit}
                  onChange={(e) => setManualUnit(e.target.value as TorqueUnit)}
                  className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 bg-white px-2 text-lg"
                >
                  <UnitOptions units={TORQUE_UNITS} />
                </select>
              </div>
            </div>
          )}
          {order ? (
            <p className="text-lg">
              Star pattern for {lug.count} lug nuts: <strong>{order.join(' → ')}</strong>
            </p>
          ) : (
            <p className="text-lg">
              Run the lug nuts down in a star pattern: each next nut across from the last.
            </p>
          )}
          {box}
        </div>
      }
    />
  );
}
