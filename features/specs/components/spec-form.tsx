'use client';

import { useState } from 'react';
import {
  PRESSURE_UNITS,
  THREAD_CONDITION_LABELS,
  THREAD_CONDITIONS,
  TORQUE_UNITS,
  UNIT_LABELS,
  type PressureUnit,
  type TorqueUnit,
} from '@/features/torque-plan';
import { Button } from '@/features/ui/button';
import { CheckboxField } from '@/features/ui/checkbox';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { useFormAction } from '@/features/ui/use-form-action';
import { createWheelSpec, updateWheelSpec } from '../actions/save-spec';
import { engineErrors, specToInput } from '../engine-check';
import { liveCheck } from '../live-check';
import { specSchema, type SpecInput } from '../schemas';
import type { Spec } from '../server/specs';
import { FieldNote } from './field-note';
import { SpecFlag } from './spec-flag';
import { SpecPreview, type CribWrench } from './spec-preview';

const threadConditionOptions = [
  { value: '', label: 'Not stated by the maker' },
  ...THREAD_CONDITIONS.map((c) => ({ value: c, label: THREAD_CONDITION_LABELS[c] })),
];
const torqueOptions = TORQUE_UNITS.map((u) => ({ value: u, label: UNIT_LABELS[u] }));
const pressureOptions = PRESSURE_UNITS.map((u) => ({ value: u, label: UNIT_LABELS[u] }));
const patternOptions = [
  { value: 'cross', label: 'Cross (groups of four, 90° apart)' },
  { value: 'skip', label: 'Skip (every k-th bolt)' },
  { value: 'sequential', label: 'Sequential (clockwise)' },
];

/** Fields the browser checks again as the person types (engine and plausibility). */
const LIVE_FIELDS = new Set([
  'boltCount',
  'skipStep',
  'passPercents',
  'finalTorque',
  'torqueUnit',
  'lugTorque',
  'maxBeadSeatPressure',
  'runningPressure',
  'pressureUnit',
  'beadSeatRatingReference',
  'beadSeatRatingConfirmed',
]);

type Live = {
  spec?: SpecInput;
  engine?: Record<string, string[]>;
  checks?: ReturnType<typeof liveCheck>;
};

function readLive(form: HTMLFormElement): Live {
  const raw = Object.fromEntries(new FormData(form));
  // Plausibility runs on whatever is typed so far; the preview needs the whole spec.
  const checks = liveCheck(raw);
  const parsed = specSchema.safeParse(raw);
  if (!parsed.success) return { checks };
  const engine = engineErrors(parsed.data);
  return engine ? { engine, checks } : { spec: parsed.data, checks };
}

/**
 * Create or edit a wheel spec. While typing, the engine checks the spec in the browser and the
 * preview shows each pass's wrench and setting; the server checks it all again on save.
 */
export function SpecForm({
  spec,
  wrenches,
  minFractionOfMax,
  units,
}: {
  spec?: Spec;
  wrenches: CribWrench[];
  /** The shop's wrench floor, for the preview. */
  minFractionOfMax: number;
  /** The shop's default units, for a new spec. */
  units: { torque: TorqueUnit; pressure: PressureUnit };
}) {
  const { state, formAction, pending, errors, value } = useFormAction(
    spec ? updateWheelSpec : createWheelSpec,
    { leaves: spec ? undefined : 'Spec saved.' },
  );
  const [live, setLive] = useState<Live>({});
  const initial = (name: keyof Spec, fallback = '') =>
    value(name) ?? (spec?.[name] == null ? fallback : String(spec[name]));
  // After a refused save, what the person types next is judged live: the server's message at a
  // field goes once that field (or, for the checks that read several fields, any field) changes.
  const [edited, setEdited] = useState<{ after: unknown; names: string[] }>({
    after: null,
    names: [],
  });
  const editedSinceSave = edited.after === state && edited.names.length > 0;
  const serverErrors = (name: string) =>
    editedSinceSave && (edited.names.includes(name) || LIVE_FIELDS.has(name))
      ? undefined
      : errors(name);
  const fieldErrors = (name: string) =>
    serverErrors(name) ?? live.engine?.[name] ?? live.checks?.errors[name];
  const warnings = (name: string) => live.checks?.warnings[name];
  const shown = state?.ok ? { ok: true, message: 'Spec saved.' } : state;

  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <form
        action={formAction}
        onChange={(e) => {
          // The event bubbles from the input that changed (React types it as the form).
          const { name = '' } = e.target as unknown as { name?: string };
          setEdited((prev) => ({
            after: state,
            names: prev.after === state ? [...prev.names, name] : [name],
          }));
          setLive(readLive(e.currentTarget));
        }}
        noValidate
        className="flex flex-col gap-6"
        aria-label="Wheel spec"
      >
        <FormMessage state={shown} />
        {spec?.plausibilityFlag ? <SpecFlag reason={spec.plausibilityFlag} canFix /> : null}
        {spec ? <input type="hidden" name="specId" value={spec.id} /> : null}
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-lg font-bold">Wheel and ring</legend>
          <TextField
            label="Spec name"
            name="name"
            required
            defaultValue={initial('name')}
            errors={fieldErrors('name')}
            hint="How the shop calls this wheel, e.g. “15 in UTV beadlock, 24 bolts”."
          />
          <TextField
            label="Bolt count"
            name="boltCount"
            inputMode="numeric"
            required
            defaultValue={initial('boltCount')}
            errors={fieldErrors('boltCount')}
            hint="4 to 64 ring bolts."
          />
          <TextField
            label="Ring bolt thread"
            name="boltThread"
            required
            defaultValue={initial('boltThread')}
            errors={fieldErrors('boltThread')}
            hint="e.g. M8×1.25 or 5/16-18."
          />
        </fieldset>
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-lg font-bold">Torque passes</legend>
          <div className="grid grid-cols-[2fr_1fr] gap-3">
            <TextField
              label="Final torque"
              name="finalTorque"
              inputMode="decimal"
              required
              defaultValue={initial('finalTorque')}
              errors={fieldErrors('finalTorque')}
              hint={<FieldNote warnings={warnings('finalTorque')} />}
            />
            <SelectField
              label="Unit"
              name="torqueUnit"
              options={torqueOptions}
              defaultValue={initial('torqueUnit', units.torque)}
              errors={fieldErrors('torqueUnit')}
            />
          </div>
          <TextField
            label="Passes (% of final)"
            name="passPercents"
            defaultValue={value('passPercents') ?? spec?.passPercents.join(', ') ?? '30, 70, 100'}
            errors={fieldErrors('passPercents')}
            hint="Never going down, ending at 100; repeat a pass for a second lap at the same target. ASME PCC-1 (from memory) uses rounds of about 20–30, 50–70 and 100."
          />
          <SelectField
            label="Tightening pattern"
            name="patternKind"
            options={patternOptions}
            defaultValue={initial('patternKind', 'cross')}
            errors={fieldErrors('patternKind')}
          />
          <TextField
            label="Skip step (skip pattern only)"
            name="skipStep"
            inputMode="numeric"
            defaultValue={initial('skipStep')}
            errors={fieldErrors('skipStep')}
            hint="Tighten every k-th bolt, e.g. 5 on a 20-bolt ring."
          />
          <CheckboxField
            label="Check pass at 100 %"
            name="checkPass"
            defaultChecked={spec ? spec.checkPass : true}
            hint="Goes round clockwise after the last staged pass."
          />
        </fieldset>
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-lg font-bold">Lug nuts (re-install)</legend>
          <div className="grid grid-cols-[2fr_1fr] gap-3">
            <TextField
              label="Lug-nut torque"
              name="lugTorque"
              inputMode="decimal"
              defaultValue={initial('lugTorque')}
              errors={fieldErrors('lugTorque')}
            />
            <SelectField
              label="Unit"
              name="lugTorqueUnit"
              options={torqueOptions}
              defaultValue={initial('lugTorqueUnit', units.torque)}
              errors={fieldErrors('lugTorqueUnit')}
            />
          </div>
          <TextField
            label="Lug count"
            name="lugCount"
            inputMode="numeric"
            defaultValue={initial('lugCount')}
            errors={fieldErrors('lugCount')}
          />
        </fieldset>
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-lg font-bold">Pressure</legend>
          <TextField
            label="Maximum bead-seating pressure"
            name="maxBeadSeatPressure"
            inputMode="decimal"
            required
            defaultValue={initial('maxBeadSeatPressure')}
            errors={fieldErrors('maxBeadSeatPressure')}
            hint={
              <FieldNote
                hint="From the tire maker. Never exceed it while seating the bead; above 40 psi needs the tire maker's rating below."
                warnings={warnings('maxBeadSeatPressure')}
              />
            }
          />
          <TextField
            label="Running pressure"
            name="runningPressure"
            inputMode="decimal"
            required
            defaultValue={initial('runningPressure')}
            errors={fieldErrors('runningPressure')}
            hint={<FieldNote warnings={warnings('runningPressure')} />}
          />
          <SelectField
            label="Pressure unit"
            name="pressureUnit"
            options={pressureOptions}
            defaultValue={initial('pressureUnit', units.pressure)}
            errors={fieldErrors('pressureUnit')}
          />
          <BeadSeatRating
            spec={spec}
            initial={initial('beadSeatRatingReference')}
            errors={fieldErrors('beadSeatRatingReference')}
            confirmErrors={fieldErrors('beadSeatRatingConfirmed')}
          />
        </fieldset>
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-lg font-bold">Maker&apos;s spec and notes</legend>
          <TextField
            label="Wheel maker's spec (link or reference)"
            name="makerReference"
            defaultValue={initial('makerReference')}
            errors={fieldErrors('makerReference')}
          />
          <SelectField
            label="Thread condition when torqued"
            name="threadCondition"
            options={threadConditionOptions}
            defaultValue={initial('threadCondition')}
            errors={fieldErrors('threadCondition')}
            hint="As the wheel maker states it: the same setting clamps harder on lubricated threads. The runner shows it at hand-start and the first pass."
          />
          <TextField
            label="Bolt reuse"
            name="boltReuse"
            placeholder="e.g. replace ring bolts at every tire change"
            defaultValue={initial('boltReuse')}
            errors={fieldErrors('boltReuse')}
          />
          <TextField
            label="Notes"
            name="notes"
            defaultValue={initial('notes')}
            errors={fieldErrors('notes')}
          />
        </fieldset>
        <Button disabled={pending}>
          {pending ? 'Saving…' : spec ? 'Save spec' : 'Create spec'}
        </Button>
      </form>
      <div>
        {live.spec || spec ? (
          <SpecPreview
            spec={live.spec ?? specToInput(spec!)}
            wrenches={wrenches}
            minFractionOfMax={minFractionOfMax}
          />
        ) : (
          <p className="border-paper-line text-ink-soft rounded-xl border-2 border-dashed p-4">
            Fill in the bolt count, torque and passes to see the sequence and each pass&apos;s
            wrench.
          </p>
        )}
      </div>
    </div>
  );
}

/** The tire maker's higher bead-seat rating: its reference, and a lead's tick that they checked it. */
function BeadSeatRating({
  spec,
  initial,
  errors,
  confirmErrors,
}: {
  spec?: Spec;
  initial: string;
  errors?: string[];
  confirmErrors?: string[];
}) {
  return (
    <>
      <TextField
        label="Tire maker's higher bead-seat rating (document and page)"
        name="beadSeatRatingReference"
        defaultValue={initial}
        errors={errors}
        hint="Only for a limit above 40 psi (275.8 kPa, 2.758 bar), the tire industry's bead-seating ceiling: the tire maker's own published rating for this tire."
      />
      <div>
        <CheckboxField
          label="I am a lead and I checked this rating in the tire maker's document"
          name="beadSeatRatingConfirmed"
          defaultChecked={Boolean(spec?.beadSeatRatingConfirmedAt)}
          aria-invalid={confirmErrors?.length ? true : undefined}
          aria-describedby={confirmErrors?.length ? 'beadSeatRatingConfirmed-error' : undefined}
        />
        {spec?.beadSeatRatingConfirmedAt ? (
          <p className="text-ink-soft text-sm">
            Confirmed by a lead on <ShopTime when={spec.beadSeatRatingConfirmedAt} />. Saving a
            changed limit or reference with the box ticked confirms it again in your name.
          </p>
        ) : null}
        {confirmErrors?.length ? (
          <p
            id="beadSeatRatingConfirmed-error"
            role="alert"
            className="text-danger text-sm font-semibold"
          >
            {confirmErrors.join(' ')}
          </p>
        ) : null}
      </div>
    </>
  );
}
