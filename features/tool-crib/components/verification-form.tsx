'use client';

import { TORQUE_UNITS, UNIT_LABELS } from '@/features/torque-plan';
import { Button } from '@/features/ui/button';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useShopTime } from '@/features/ui/shop-time-zone';
import { useFormAction } from '@/features/ui/use-form-action';
import { verifyWrench } from '../actions/wrench-actions';

const units = TORQUE_UNITS.map((u) => ({ value: u, label: UNIT_LABELS[u] }));

export function VerificationForm({
  wrenchId,
  unit,
}: {
  wrenchId: string;
  unit: 'lbf-ft' | 'lbf-in' | 'Nm';
}) {
  const { state, formAction, pending, errors, value } = useFormAction(verifyWrench);
  const clock = useShopTime();
  const at =
    state?.ok && state.data ? ` Recorded ${clock.format(state.data.recordedAt, 'time')}.` : '';
  const verdict =
    state?.ok && state.data
      ? state.data.withinTolerance
        ? {
            ok: true,
            message: `Within tolerance: ${signed(state.data.deviationPct)} % (allowed ±${state.data.tolerancePct} %).${at}`,
          }
        : {
            ok: false,
            message: `Out of tolerance: ${signed(state.data.deviationPct)} % (allowed ±${state.data.tolerancePct} %). The wrench is out of service until a lead clears it.${at}`,
          }
      : state;
  return (
    <form
      action={formAction}
      noValidate
      className="flex flex-col gap-4"
      aria-label="Record a verification"
    >
      <FormMessage state={verdict} />
      <input type="hidden" name="wrenchId" value={wrenchId} />
      <div className="grid grid-cols-2 gap-3">
        <TextField
          label="Reference value"
          name="referenceValue"
          inputMode="decimal"
          required
          defaultValue={value('referenceValue')}
          errors={errors('referenceValue')}
          hint="What the tester was set to."
        />
        <TextField
          label="Reading"
          name="readingValue"
          inputMode="decimal"
          required
          defaultValue={value('readingValue')}
          errors={errors('readingValue')}
          hint="What the tester showed at the click."
        />
      </div>
      <SelectField
        label="Unit"
        name="unit"
        options={units}
        defaultValue={value('unit') ?? unit}
        errors={errors('unit')}
      />
      <Button disabled={pending}>{pending ? 'Recording…' : 'Record verification'}</Button>
    </form>
  );
}

const signed = (n: number) => `${n > 0 ? '+' : ''}${n.toFixed(1)}`;
