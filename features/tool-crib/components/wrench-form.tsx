'use client';

import { TORQUE_UNITS, UNIT_LABELS, type TorqueUnit } from '@/features/torque-plan';
import { Button } from '@/features/ui/button';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { addWrench, editWrench } from '../actions/wrench-actions';
import { WRENCH_KINDS } from '../schemas';
import type { CribWrenchDto } from '../server/wrenches';

const units = TORQUE_UNITS.map((u) => ({ value: u, label: UNIT_LABELS[u] }));
const kinds = WRENCH_KINDS.map((k) => ({ value: k, label: k[0]!.toUpperCase() + k.slice(1) }));

/** Add a wrench (starting in the shop's torque unit) or edit one. */
export function WrenchForm({
  wrench,
  defaultUnit,
}:
  | { wrench: CribWrenchDto; defaultUnit?: never }
  | { wrench?: undefined; defaultUnit: TorqueUnit }) {
  const { state, formAction, pending, errors, value } = useFormAction(
    wrench ? editWrench : addWrench,
    { leaves: wrench ? undefined : 'Wrench added to the tool crib.' },
  );
  const initial = (name: keyof CribWrenchDto, fallback = '') =>
    value(name) ?? (wrench?.[name] == null ? fallback : String(wrench[name]));
  return (
    <form
      action={formAction}
      noValidate
      className="flex flex-col gap-4"
      aria-label={wrench ? 'Edit wrench' : 'Add a wrench'}
    >
      <FormMessage state={state?.ok ? { ok: true, message: 'Wrench saved.' } : state} />
      {wrench ? <input type="hidden" name="wrenchId" value={wrench.id} /> : null}
      <TextField
        label="Label"
        name="label"
        required
        defaultValue={initial('label')}
        errors={errors('label')}
        hint="What is written on the wrench or its case."
      />
      <SelectField
        label="Kind"
        name="kind"
        options={kinds}
        defaultValue={initial('kind', 'click')}
        errors={errors('kind')}
      />
      <div className="grid grid-cols-3 gap-3">
        <TextField
          label="Lowest mark"
          name="min"
          inputMode="decimal"
          required
          defaultValue={initial('min')}
          errors={errors('min')}
        />
        <TextField
          label="Highest mark"
          name="max"
          inputMode="decimal"
          required
          defaultValue={initial('max')}
          errors={errors('max')}
        />
        <SelectField
          label="Unit"
          name="unit"
          options={units}
          defaultValue={initial('unit', defaultUnit ?? wrench?.unit)}
          errors={errors('unit')}
        />
      </div>
      <TextField
        label="Graduation"
        name="graduation"
        inputMode="decimal"
        required
        defaultValue={initial('graduation', '1')}
        errors={errors('graduation')}
        hint="The smallest step you can set, in the wrench's unit."
      />
      <TextField
        label="Serial number"
        name="serial"
        defaultValue={initial('serial')}
        errors={errors('serial')}
      />
      <TextField
        label="Calibration due"
        name="calibrationDueOn"
        type="date"
        required
        defaultValue={initial('calibrationDueOn')}
        errors={errors('calibrationDueOn')}
        hint="Usually 12 months after the last calibration (ISO 6789), or sooner by the shop's procedure."
      />
      <TextField
        label="Cycles since calibration (if known)"
        name="cyclesSinceCalibration"
        inputMode="numeric"
        defaultValue={initial('cyclesSinceCalibration')}
        errors={errors('cyclesSinceCalibration')}
        hint="At 5,000 cycles the wrench goes out of service for recalibration."
      />
      <Button disabled={pending}>
        {pending ? 'Saving…' : wrench ? 'Save wrench' : 'Add wrench'}
      </Button>
    </form>
  );
}
