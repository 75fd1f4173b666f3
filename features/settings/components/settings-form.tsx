'use client';

import { useState } from 'react';
import { PRESSURE_UNITS, TORQUE_UNITS } from '@/features/torque-plan';
import { Button } from '@/features/ui/button';
import { CheckboxField } from '@/features/ui/checkbox';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { UnitOptions } from '@/features/ui/unit-options';
import { useFormAction } from '@/features/ui/use-form-action';
import { saveSettings } from '../actions/save-settings';
import type { ShopSettings } from '@/server/shop/settings';

const fieldset = 'flex flex-col gap-4 rounded-xl border-2 border-paper-line p-4';
const legend = 'px-1 text-lg font-bold';

function UnitSelect({
  label,
  name,
  units,
  value,
  hint,
  errors,
}: {
  label: string;
  name: string;
  units: readonly string[];
  value: string;
  hint: string;
  errors?: string[];
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={name} className="font-semibold">
        {label}
      </label>
      <select
        id={name}
        name={name}
        defaultValue={value}
        aria-describedby={`${name}-hint${errors ? ` ${name}-error` : ''}`}
        aria-invalid={errors ? true : undefined}
        className="min-h-touch border-ink-soft bg-paper w-full rounded-lg border-2 px-3 text-base"
      >
        <UnitOptions units={units as never} />
      </select>
      <p id={`${name}-hint`} className="text-ink-soft text-sm">
        {hint}
      </p>
      {errors ? (
        <p id={`${name}-error`} role="alert" className="text-danger text-sm font-semibold">
          {errors.join(' ')}
        </p>
      ) : null}
    </div>
  );
}

/**
 * The shop's own rules, each explained in a sentence a lead can act on. Field names are the
 * API's JSON paths ("verification.days"), so errors land on the field the server names.
 */
export function SettingsForm({
  settings,
  timeZones,
}: {
  settings: ShopSettings;
  timeZones: string[];
}) {
  const { state, formAction, pending, errors, value } = useFormAction(saveSettings);
  // After a save the form shows what was stored, not what the page first loaded.
  const current = state?.ok ? state.data : settings;
  const [recency, setRecency] = useState(current.verification.recency);
  const text = (name: string, stored: string | number) => value(name) ?? String(stored);
  const shown = state?.ok
    ? {
        ok: true,
        message: 'Settings saved. New plans, runner screens and forms use them from now on.',
      }
    : state;

  return (
    <form
      action={formAction}
      noValidate
      aria-label="Shop settings"
      className="flex max-w-2xl flex-col gap-6"
    >
      <FormMessage state={shown} />
      <fieldset className={fieldset}>
        <legend className={legend}>Clock</legend>
        <TextField
          label="Time zone"
          name="timeZone"
          list="time-zone-names"
          autoComplete="off"
          spellCheck={false}
          key={`tz-${current.timeZone}`}
          defaultValue={text('timeZone', current.timeZone)}
          errors={errors('timeZone')}
          hint="Every date and time is shown in this zone, and “today” (verifications, jobs due) means today at the shop; type a city to search, e.g. America/Denver."
        />
        <datalist id="time-zone-names">
          {timeZones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </fieldset>

      <fieldset className={fieldset}>
        <legend className={legend}>Wrenches</legend>
        <TextField
          label="Wrench floor (% of maximum)"
          name="wrenchFloorPercent"
          inputMode="decimal"
          key={`floor-${current.wrenchFloorPercent}`}
          defaultValue={text('wrenchFloorPercent', current.wrenchFloorPercent)}
          errors={errors('wrenchFloorPercent')}
          hint="A wrench is not offered for a setting below this share of its maximum (20 % is where ISO 6789 calibration starts); 0 lets only the wrench's lowest mark limit it, so one 5–80 ft-lb wrench can run a ring."
        />
        <SelectField
          label="Verification must be from"
          name="verification.recency"
          value={recency}
          onChange={(e) => setRecency(e.target.value as typeof recency)}
          options={[
            { value: 'same_day', label: 'The same shop day' },
            { value: 'within_days', label: 'The last few days' },
          ]}
          errors={errors('verification.recency')}
          hint="How recent a passing check on the torque tester must be before the runner lets a technician use the wrench."
        />
        {recency === 'within_days' ? (
          <TextField
            label="Number of days"
            name="verification.days"
            inputMode="numeric"
            defaultValue={text('verification.days', current.verification.days)}
            errors={errors('verification.days')}
            hint="1 is today only; 7 is today and the six days before."
          />
        ) : null}
        <TextField
          label="Verified near the setting (± %)"
          name="verification.nearPercent"
          inputMode="decimal"
          key={`near-${current.verification.nearPercent}`}
          defaultValue={text('verification.nearPercent', current.verification.nearPercent)}
          errors={errors('verification.nearPercent')}
          hint="A check counts for a pass only when the tester's reference was within this % of the setting the pass uses (a check at 10 ft-lb says little about 60 ft-lb); 0 accepts a check at any point."
        />
      </fieldset>

      <fieldset className={fieldset}>
        <legend className={legend}>Sign-off and customers</legend>
        <TextField
          label="Too fast (seconds per bolt)"
          name="tooFastSecondsPerBolt"
          inputMode="decimal"
          key={`fast-${current.tooFastSecondsPerBolt}`}
          defaultValue={text('tooFastSecondsPerBolt', current.tooFastSecondsPerBolt)}
          errors={errors('tooFastSecondsPerBolt')}
          hint="Bolts confirmed faster than this, one after another, are pointed out to the lead at sign-off: nobody pulls a click wrench that quickly."
        />
        <TextField
          label="Re-check after the first ride (days)"
          name="recheckDays"
          inputMode="numeric"
          key={`recheck-${current.recheckDays}`}
          defaultValue={text('recheckDays', current.recheckDays)}
          errors={errors('recheckDays')}
          hint="How many days after pick-up the customer is asked to come back so the ring bolts can be re-torqued."
        />
        <CheckboxField
          label="A single lead may sign off their own work"
          name="singleLeadSelfSignoff"
          key={`self-${String(current.singleLeadSelfSignoff)}`}
          defaultChecked={current.singleLeadSelfSignoff}
          hint="Only for a shop with one lead: they may sign off a job they did themselves, with a written reason; leave it off when a second person can check."
        />
      </fieldset>

      <fieldset className={fieldset}>
        <legend className={legend}>Units</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <UnitSelect
            key={`p-${current.pressureUnit}`}
            label="Pressure unit"
            name="pressureUnit"
            units={PRESSURE_UNITS}
            value={current.pressureUnit}
            errors={errors('pressureUnit')}
            hint="New specs and job cards start in this unit; a spec keeps the unit it was written in."
          />
          <UnitSelect
            key={`t-${current.torqueUnit}`}
            label="Torque unit"
            name="torqueUnit"
            units={TORQUE_UNITS}
            value={current.torqueUnit}
            errors={errors('torqueUnit')}
            hint="New specs and wrenches start in this unit; each wrench is still set in its own scale's unit."
          />
        </div>
      </fieldset>

      <Button disabled={pending}>{pending ? 'Saving…' : 'Save settings'}</Button>
    </form>
  );
}
