'use client';

import { startTransition, useMemo, useState } from 'react';
import type { PressureUnit } from '@/features/torque-plan';
import { Button } from '@/features/ui/button';
import { CheckboxField } from '@/features/ui/checkbox';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { zoneLabel } from '@/features/ui/shop-time';
import { useShopTime } from '@/features/ui/shop-time-zone';
import { useFormAction } from '@/features/ui/use-form-action';
import { createJobCard } from '../actions/job-actions';
import { axleWarnings, intakeWarnings } from '../axle-check';
import type { Customer, Vehicle } from '../server/customers';
import { WheelRows, type SpecOption, type WheelDraft } from './wheel-rows';

type Props = {
  customers: Customer[];
  vehicles: (Vehicle & { label: string })[];
  specs: SpecOption[];
  assignees: { id: string; name: string }[];
  canAcceptVin: boolean;
  /** The shop's pressure unit, for the wheels' target pressures. */
  pressureUnit: PressureUnit;
};

/**
 * A new job card: customer and vehicle (picked or added here), the wheels, and who does it when.
 * The axle check runs as the tires are typed; mismatched tires need "Save anyway".
 */
export function JobForm({
  customers,
  vehicles,
  specs,
  assignees,
  canAcceptVin,
  pressureUnit,
}: Props) {
  const { state, formAction, pending, errors } = useFormAction(createJobCard, {
    leaves: 'Job card created.',
  });
  const clock = useShopTime();
  const [customerMode, setCustomerMode] = useState<'existing' | 'new'>(
    customers.length ? 'existing' : 'new',
  );
  const [customerId, setCustomerId] = useState(customers[0]?.id ?? '');
  const ownVehicles = useMemo(
    () => vehicles.filter((v) => v.customerId === customerId),
    [vehicles, customerId],
  );
  const [vehicleMode, setVehicleMode] = useState<'existing' | 'new'>('existing');
  const [vehicleId, setVehicleId] = useState('');
  const [wheels, setWheels] = useState<WheelDraft[]>([]);
  const warnings = useMemo(() => axleWarnings(wheels.filter((w) => w.tireSize.trim())), [wheels]);
  const axleNotes = useMemo(() => intakeWarnings(wheels), [wheels]);
  const useExistingVehicle =
    customerMode === 'existing' && vehicleMode === 'existing' && ownVehicles.length > 0;

  function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const get = (k: string) => String(f.get(k) ?? '');
    const payload = {
      ...(customerMode === 'existing'
        ? { customerId }
        : {
            customer: {
              name: get('customerName'),
              phone: get('customerPhone'),
              email: get('customerEmail'),
            },
          }),
      ...(useExistingVehicle
        ? { vehicleId: vehicleId || ownVehicles[0]!.id }
        : {
            vehicle: {
              year: get('vehicleYear'),
              make: get('vehicleMake'),
              model: get('vehicleModel'),
              description: get('vehicleDescription'),
              vin: get('vehicleVin'),
              vinOverride: f.get('vinOverride') === 'on',
            },
          }),
      wheels: wheels.map((w) => ({ ...w, targetPressure: w.targetPressure })),
      dismount: f.get('dismount') === 'on',
      reinstall: f.get('reinstall') === 'on',
      assigneeId: get('assigneeId'),
      // Typed on the shop's clock, not the phone's.
      dueAt: clock.fromLocalInput(get('dueAt')),
      notes: get('notes'),
      acceptAxleMismatch: f.get('acceptAxleMismatch') === 'on',
    };
    startTransition(() => formAction(payload as Parameters<typeof createJobCard>[1]));
  }

  const vehicleError = errors('vehicleId') ?? errors('vehicle.make');
  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex max-w-2xl flex-col gap-6"
      aria-label="New job card"
    >
      <FormMessage state={state} />
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold">Customer</legend>
        <div className="flex flex-wrap gap-2">
          {customers.length ? (
            <ModeButton
              label="Existing customer"
              active={customerMode === 'existing'}
              onClick={() => setCustomerMode('existing')}
            />
          ) : null}
          <ModeButton
            label="New customer"
            active={customerMode === 'new'}
            onClick={() => setCustomerMode('new')}
          />
        </div>
        {customerMode === 'existing' ? (
          <SelectField
            label="Customer"
            name="customerId"
            value={customerId}
            onChange={(e) => {
              setCustomerId(e.target.value);
              setVehicleId('');
            }}
            options={customers.map((c) => ({
              value: c.id,
              label: c.phone ? `${c.name} · ${c.phone}` : c.name,
            }))}
            errors={errors('customerId')}
          />
        ) : (
          <>
            <TextField
              label="Customer name"
              name="customerName"
              errors={errors('customer.name') ?? errors('customerId')}
            />
            <TextField
              label="Phone"
              name="customerPhone"
              type="tel"
              errors={errors('customer.phone')}
            />
            <TextField
              label="E-mail"
              name="customerEmail"
              type="email"
              errors={errors('customer.email')}
              hint="For the completion report and the re-check reminder."
            />
          </>
        )}
      </fieldset>
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold">Vehicle</legend>
        {customerMode === 'existing' && ownVehicles.length ? (
          <div className="flex flex-wrap gap-2">
            <ModeButton
              label="Customer's vehicle"
              active={vehicleMode === 'existing'}
              onClick={() => setVehicleMode('existing')}
            />
            <ModeButton
              label="Another vehicle"
              active={vehicleMode === 'new'}
              onClick={() => setVehicleMode('new')}
            />
          </div>
        ) : null}
        {useExistingVehicle ? (
          <SelectField
            label="Vehicle"
            name="vehicleId"
            value={vehicleId || ownVehicles[0]!.id}
            onChange={(e) => setVehicleId(e.target.value)}
            options={ownVehicles.map((v) => ({
              value: v.id,
              label: v.vin ? `${v.label} · VIN ${v.vin}` : v.label,
            }))}
            errors={errors('vehicleId')}
          />
        ) : (
          <>
            <div className="grid grid-cols-3 gap-3">
              <TextField
                label="Year"
                name="vehicleYear"
                inputMode="numeric"
                errors={errors('vehicle.year')}
              />
              <TextField label="Make" name="vehicleMake" errors={vehicleError} />
              <TextField label="Model" name="vehicleModel" errors={errors('vehicle.model')} />
            </div>
            <TextField
              label="Description"
              name="vehicleDescription"
              hint="e.g. “red side-by-side, long-travel kit”."
              errors={errors('vehicle.description')}
            />
            <TextField
              label="VIN (optional)"
              name="vehicleVin"
              errors={errors('vehicle.vin') ?? errors('vin')}
            />
            {canAcceptVin ? (
              <CheckboxField
                label="Accept the VIN even if its check digit does not match"
                name="vinOverride"
                hint="Some off-road vehicles carry VINs that do not follow 49 CFR 565."
              />
            ) : null}
          </>
        )}
      </fieldset>
      <WheelRows
        wheels={wheels}
        specs={specs}
        pressureUnit={pressureUnit}
        onChange={setWheels}
        errors={errors}
      />
      {warnings.length ? (
        <div
          role="alert"
          className="border-caution bg-caution-tint text-caution-ink flex flex-col gap-2 rounded-lg border-l-8 p-3"
        >
          <p className="font-bold">Tire check</p>
          {warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
          <CheckboxField
            label="Save anyway (the vehicle maker allows it)"
            name="acceptAxleMismatch"
          />
        </div>
      ) : null}
      {axleNotes.length ? (
        <div
          role="status"
          className="border-caution bg-caution-tint text-caution-ink flex flex-col gap-2 rounded-lg border-l-8 p-3"
        >
          <p className="font-bold">One wheel of an axle</p>
          {axleNotes.map((w) => (
            <p key={w}>{w}</p>
          ))}
          <p>The job card can still be saved; check with the customer.</p>
        </div>
      ) : null}
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold">The work</legend>
        <CheckboxField label="Dismount the old tire" name="dismount" defaultChecked />
        <CheckboxField
          label="Re-install the wheel on the vehicle"
          name="reinstall"
          defaultChecked
        />
        <SelectField
          label="Assigned to"
          name="assigneeId"
          options={[
            { value: '', label: 'Nobody yet' },
            ...assignees.map((a) => ({ value: a.id, label: a.name })),
          ]}
          errors={errors('assigneeId')}
        />
        <TextField
          label="Due"
          name="dueAt"
          type="datetime-local"
          errors={errors('dueAt')}
          hint={`Shop time: ${zoneLabel(clock.timeZone)}.`}
        />
        <TextField label="Notes" name="notes" errors={errors('notes')} />
      </fieldset>
      <Button disabled={pending}>{pending ? 'Creating…' : 'Create job card'}</Button>
    </form>
  );
}

function ModeButton({
  label,
  active,
  onClick,
}: {
  label: string;
  active: boolean;
  onClick: () => void;
}) {
  return (
    <button
      type="button"
      aria-pressed={active}
      onClick={onClick}
      className={`min-h-touch rounded-lg border-2 px-4 font-semibold ${active ? 'border-work bg-work text-white' : 'border-ink bg-paper'}`}
    >
      {label}
    </button>
  );
}
