'use client';

import { useState } from 'react';
import {
  convertPressure,
  pressureOffTarget,
  PRESSURE_UNITS,
  UNIT_LABELS,
  type PressureUnit,
} from '@/features/torque-plan';
import { UnitOptions } from '@/features/ui/unit-options';
import type { RunEvent } from '../events';
import type { Step } from '../steps';
import { Caution } from './caution';
import { ReasonForm } from './reason-form';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';

/**
 * A checklist step: tick every item, record the reading if the step asks for one, then "Step
 * done". An optional step can be skipped with a reason; the inspection can fail the wheel.
 */
export function StepPanel({
  step,
  record,
  extra,
  limit,
  readingUnit,
  blocked,
  target,
  extraChecked = [],
}: {
  step: Step;
  record: (e: RunEvent) => Promise<void>;
  extra?: React.ReactNode;
  /** The highest reading allowed (bead seating), with its unit. */
  limit?: { value: number; unit: PressureUnit };
  /** The unit a reading starts in without a limit: the wheel's own (from the shop's setting). */
  readingUnit: PressureUnit;
  /** Why "Step done" must wait (e.g. photos still missing). */
  blocked?: string;
  /** The wheel's target pressure: a reading further off than the tolerance asks for a re-check. */
  target?: { value: number; unit: PressureUnit };
  /** Items recorded with the checklist that the step's own controls supply (e.g. a lug torque typed from the vehicle's manual). */
  extraChecked?: string[];
}) {
  const [ticked, setTicked] = useState<string[]>([]);
  const [value, setValue] = useState('');
  const [unit, setUnit] = useState<PressureUnit>(limit?.unit ?? readingUnit);
  const [skipping, setSkipping] = useState(false);
  const [failing, setFailing] = useState(false);
  const [reason, setReason] = useState('');
  const reading = value.trim() ? Number(value.replace(',', '.')) : null;
  const overLimit =
    reading !== null && limit
      ? convertPressure(reading, unit, limit.unit) > limit.value + 1e-9
      : false;
  const readingOk =
    !step.measurement ||
    (reading !== null && Number.isFinite(reading) && reading > 0 && !overLimit);
  const off =
    target && reading !== null && Number.isFinite(reading) && reading > 0
      ? pressureOffTarget({ value: reading, unit }, target)
      : null;
  const [rechecked, setRechecked] = useState(false);
  // The limit in the unit being typed, so nobody converts in their head at the gauge.
  // Rounded down, never up: a maximum shown must never be above the real one.
  const places = unit === 'bar' ? 100 : 10;
  const limitHere = limit
    ? `${Math.floor(convertPressure(limit.value, limit.unit, unit) * places + 1e-9) / places} ${UNIT_LABELS[unit]}`
    : null;
  const ready =
    ticked.length === step.checklist.length && readingOk && !blocked && (!off || rechecked);

  return (
    <div className="flex flex-col gap-4">
      <Caution items={step.cautions} />
      {extra}
      {step.checklist.length ? (
        <fieldset className="flex flex-col gap-2">
          <legend className="sr-only">Checklist</legend>
          {step.checklist.map((item) => (
            <label
              key={item.id}
              className="border-paper-line flex min-h-14 items-center gap-3 rounded-xl border-2 px-3 text-lg"
            >
              <input
                type="checkbox"
                className="accent-work size-8 shrink-0"
                checked={ticked.includes(item.id)}
                onChange={(e) =>
                  setTicked((t) =>
                    e.target.checked ? [...t, item.id] : t.filter((x) => x !== item.id),
                  )
                }
              />
              {item.text}
            </label>
          ))}
        </fieldset>
      ) : null}
      {step.measurement ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={`${step.id}-reading`} className="font-semibold">
            {step.measurement.label}
          </label>
          <div className="grid grid-cols-[2fr_1fr] gap-2">
            <input
              id={`${step.id}-reading`}
              inputMode="decimal"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              aria-invalid={overLimit || undefined}
              aria-describedby={`${step.id}-reading-note`}
              className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 px-3 text-xl"
            />
            <select
              aria-label="Pressure unit"
              value={unit}
              onChange={(e) => setUnit(e.target.value as PressureUnit)}
              className="border-ink-soft min-h-14 min-w-0 rounded-xl border-2 px-2 text-lg"
            >
              <UnitOptions units={PRESSURE_UNITS} />
            </select>
          </div>
          <p
            id={`${step.id}-reading-note`}
            className={overLimit ? 'text-danger font-bold' : 'text-ink-soft text-sm'}
            role={overLimit ? 'alert' : undefined}
          >
            {overLimit
              ? `Above the tire's maximum bead-seating pressure (${limitHere}). Stop, let the air out and find out why.`
              : reading && Number.isFinite(reading)
                ? PRESSURE_UNITS.filter((u) => u !== unit)
                    .map(
                      (u) =>
                        `${Number(convertPressure(reading, unit, u).toFixed(2))} ${UNIT_LABELS[u]}`,
                    )
                    .join(' · ')
                : limit
                  ? `At most ${limitHere}.`
                  : ' '}
          </p>
          {limit && reading && Number.isFinite(reading) && !overLimit ? (
            <p className="text-ink-soft text-sm">At most {limitHere}.</p>
          ) : null}
          {off ? (
            <div
              role="alert"
              className="border-caution bg-caution-tint text-caution-ink flex flex-col gap-2 rounded-xl border-2 p-3"
            >
              <p className="font-bold">
                {target!.unit === 'psi'
                  ? `${Math.abs(off.psi).toFixed(1)} psi`
                  : `${Math.abs(off.kPa).toFixed(0)} kPa`}{' '}
                {off.psi > 0 ? 'over' : 'under'} the wheel&apos;s target ({target!.value}{' '}
                {UNIT_LABELS[target!.unit]}). Adjust, then check the pressure again with the gauge.
              </p>
              <label className="flex min-h-14 items-center gap-3 text-lg">
                <input
                  type="checkbox"
                  className="size-8 shrink-0"
                  checked={rechecked}
                  onChange={(e) => setRechecked(e.target.checked)}
                />
                Re-checked: this is the pressure now.
              </label>
            </div>
          ) : null}
        </div>
      ) : null}
      {blocked ? <p className="text-danger font-semibold">{blocked}</p> : null}
      <button
        type="button"
        disabled={!ready}
        onClick={() =>
          void record({
            type: 'step_done',
            payload: {
              step: step.id,
              checklist: [...ticked, ...extraChecked],
              ...(step.measurement && reading ? { measurement: { value: reading, unit } } : {}),
            },
          })
        }
        className={`${big} bg-work disabled:bg-paper-line disabled:text-ink-soft text-white`}
      >
        Step done
      </button>
      {step.id === 'inspect' ? (
        failing ? (
          <ReasonForm
            label="What failed the inspection?"
            onCancel={() => setFailing(false)}
            value={reason}
            setValue={setReason}
            submit="Stop this wheel and flag it"
            onSubmit={() => void record({ type: 'inspection_failed', payload: { notes: reason } })}
          />
        ) : (
          <button
            type="button"
            onClick={() => setFailing(true)}
            className={`${big} border-danger text-danger border-2`}
          >
            Inspection failed…
          </button>
        )
      ) : null}
      {step.id === 'seat_bead' ? (
        // Not seated by the limit: stop, let the air out, find out why — and say so on the record
        // instead of typing a lower number to get past the step.
        failing ? (
          <ReasonForm
            label={`The bead did not seat by ${limitHere ?? 'the limit'}. Air let out? What did you find?`}
            onCancel={() => setFailing(false)}
            value={reason}
            setValue={setReason}
            submit="Stop this wheel and flag it"
            onSubmit={() =>
              void record({
                type: 'inspection_failed',
                payload: {
                  notes: `Bead did not seat by the limit${limitHere ? ` (${limitHere})` : ''}${reading !== null && Number.isFinite(reading) ? `; gauge read ${reading} ${UNIT_LABELS[unit]}` : ''}: ${reason}`,
                },
              })
            }
          />
        ) : (
          <button
            type="button"
            onClick={() => setFailing(true)}
            className={`${big} border-danger text-danger border-2`}
          >
            Bead won&apos;t seat at the limit…
          </button>
        )
      ) : null}
      {!step.required ? (
        skipping ? (
          <ReasonForm
            label="Why skip this step?"
            onCancel={() => setSkipping(false)}
            value={reason}
            setValue={setReason}
            submit="Skip the step"
            onSubmit={() =>
              void record({ type: 'step_skipped', payload: { step: step.id, reason } })
            }
          />
        ) : (
          <button
            type="button"
            onClick={() => setSkipping(true)}
            className={`${big} border-ink border-2`}
          >
            Skip this step…
          </button>
        )
      ) : null}
    </div>
  );
}
