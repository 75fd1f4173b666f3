'use client';

import { convertPressure, PRESSURE_UNITS, type PressureUnit } from '@/features/torque-plan';
import { UnitOptions } from '@/features/ui/unit-options';
import { POSITION_LABELS, POSITIONS } from '../schemas';

export type WheelDraft = {
  position: (typeof POSITIONS)[number];
  specId: string;
  tireSize: string;
  directional: boolean;
  targetPressure: string;
  pressureUnit: 'psi' | 'kPa' | 'bar';
};
export type SpecOption = {
  id: string;
  name: string;
  runningPressure: number;
  pressureUnit: 'psi' | 'kPa' | 'bar';
};

/** Decimals a gauge in each unit is read to (common practice, no source). */
const GAUGE_DIGITS: Record<PressureUnit, number> = { psi: 1, kPa: 0, bar: 2 };

/** A wheel's target starts at its spec's running pressure, in the shop's unit (a spec in bar, a shop gauge in psi). */
function targetFrom(
  spec: SpecOption,
  unit: PressureUnit,
): Pick<WheelDraft, 'targetPressure' | 'pressureUnit'> {
  if (spec.pressureUnit === unit)
    return { targetPressure: String(spec.runningPressure), pressureUnit: unit };
  const value = convertPressure(spec.runningPressure, spec.pressureUnit, unit);
  return { targetPressure: String(Number(value.toFixed(GAUGE_DIGITS[unit]))), pressureUnit: unit };
}

const input =
  'min-h-touch w-full rounded-lg border-2 border-ink-soft bg-paper px-3 text-base aria-[invalid=true]:border-danger';

/** The wheels on the job: tick a position, then its spec, tire, direction and pressure. */
export function WheelRows({
  wheels,
  specs,
  pressureUnit,
  onChange,
  errors,
}: {
  wheels: WheelDraft[];
  specs: SpecOption[];
  /** The shop's pressure unit: new wheels' targets start in it. */
  pressureUnit: PressureUnit;
  onChange: (wheels: WheelDraft[]) => void;
  errors: (path: string) => string[] | undefined;
}) {
  const toggle = (position: WheelDraft['position'], on: boolean) => {
    if (!on) return onChange(wheels.filter((w) => w.position !== position));
    const spec = specs[0];
    const draft: WheelDraft = {
      position,
      specId: spec?.id ?? '',
      tireSize: wheels[0]?.tireSize ?? '',
      directional: false,
      ...(spec ? targetFrom(spec, pressureUnit) : { targetPressure: '', pressureUnit }),
    };
    onChange(
      [...wheels, draft].sort(
        (a, b) => POSITIONS.indexOf(a.position) - POSITIONS.indexOf(b.position),
      ),
    );
  };
  const set = (position: WheelDraft['position'], patch: Partial<WheelDraft>) =>
    onChange(wheels.map((w) => (w.position === position ? { ...w, ...patch } : w)));

  return (
    <fieldset className="flex flex-col gap-4">
      <legend className="mb-2 text-lg font-bold">Wheels on the job</legend>
      <div className="flex flex-wrap gap-2">
        {POSITIONS.map((p) => (
          <label
            key={p}
            className="min-h-touch border-ink-soft flex items-center gap-2 rounded-lg border-2 px-3 font-semibold"
          >
            <input
              type="checkbox"
              className="accent-work size-6"
              checked={wheels.some((w) => w.position === p)}
              onChange={(e) => toggle(p, e.target.checked)}
            />
            {POSITION_LABELS[p]} ({p})
          </label>
        ))}
      </div>
      {errors('wheels')?.map((m) => (
        <p key={m} role="alert" className="text-danger font-semibold">
          {m}
        </p>
      ))}
      {wheels.map((w, i) => {
        const err = (f: string) => errors(`wheels.${i}.${f}`);
        const id = (f: string) => `wheel-${w.position}-${f}`;
        return (
          <section
            key={w.position}
            aria-label={`${POSITION_LABELS[w.position]} wheel`}
            className="border-paper-line grid gap-3 rounded-xl border-2 p-3 sm:grid-cols-2"
          >
            <h3 className="font-bold sm:col-span-2">{POSITION_LABELS[w.position]}</h3>
            <div className="flex flex-col gap-1">
              <label htmlFor={id('spec')} className="font-semibold">
                Wheel spec
              </label>
              <select
                id={id('spec')}
                value={w.specId}
                aria-invalid={err('specId') ? true : undefined}
                className={input}
                onChange={(e) => {
                  const spec = specs.find((s) => s.id === e.target.value);
                  set(w.position, {
                    specId: e.target.value,
                    ...(spec ? targetFrom(spec, pressureUnit) : {}),
                  });
                }}
              >
                {specs.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </select>
              {err('specId') ? (
                <p className="text-danger text-sm font-semibold">{err('specId')!.join(' ')}</p>
              ) : null}
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor={id('tire')} className="font-semibold">
                Tire size
              </label>
              <input
                id={id('tire')}
                value={w.tireSize}
                placeholder="30x10R14 or 265/70R17"
                aria-invalid={err('tireSize') ? true : undefined}
                aria-describedby={err('tireSize') ? id('tire-error') : undefined}
                className={input}
                onChange={(e) => set(w.position, { tireSize: e.target.value })}
              />
              {err('tireSize') ? (
                <p id={id('tire-error')} className="text-danger text-sm font-semibold">
                  {err('tireSize')!.join(' ')}
                </p>
              ) : null}
            </div>
            <div className="grid grid-cols-[2fr_1fr] gap-2">
              <div className="flex flex-col gap-1">
                <label htmlFor={id('pressure')} className="font-semibold">
                  Target pressure
                </label>
                <input
                  id={id('pressure')}
                  inputMode="decimal"
                  value={w.targetPressure}
                  aria-invalid={err('targetPressure') ? true : undefined}
                  className={input}
                  onChange={(e) => set(w.position, { targetPressure: e.target.value })}
                />
                {err('targetPressure') ? (
                  <p className="text-danger text-sm font-semibold">
                    {err('targetPressure')!.join(' ')}
                  </p>
                ) : null}
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor={id('unit')} className="font-semibold">
                  Unit
                </label>
                <select
                  id={id('unit')}
                  value={w.pressureUnit}
                  className={input}
                  onChange={(e) =>
                    set(w.position, { pressureUnit: e.target.value as WheelDraft['pressureUnit'] })
                  }
                >
                  <UnitOptions units={PRESSURE_UNITS} />
                </select>
              </div>
            </div>
            <label className="min-h-touch flex items-center gap-3 font-semibold">
              <input
                type="checkbox"
                className="accent-work size-6"
                checked={w.directional}
                onChange={(e) => set(w.position, { directional: e.target.checked })}
              />
              Directional tire (rotation arrow)
            </label>
          </section>
        );
      })}
    </fieldset>
  );
}
