'use client';

import { Button } from '@/features/ui/button';
import { CheckboxField } from '@/features/ui/checkbox';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { addCustomer, addVehicle, editCustomer } from '../actions/customer-actions';
import type { Customer } from '../server/customers';

export function CustomerForm({ customer }: { customer?: Customer }) {
  const { state, formAction, pending, errors, value } = useFormAction(
    customer ? editCustomer : addCustomer,
    { leaves: customer ? undefined : 'Customer added.' },
  );
  const initial = (k: keyof Customer) => value(k) ?? customer?.[k] ?? '';
  return (
    <form
      action={formAction}
      noValidate
      className="flex flex-col gap-3"
      aria-label={customer ? 'Edit customer' : 'Add a customer'}
    >
      <FormMessage state={state?.ok ? { ok: true, message: 'Saved.' } : state} />
      {customer ? <input type="hidden" name="customerId" value={customer.id} /> : null}
      <TextField
        label="Name"
        name="name"
        required
        defaultValue={initial('name')}
        errors={errors('name')}
      />
      <TextField
        label="Phone"
        name="phone"
        type="tel"
        defaultValue={initial('phone')}
        errors={errors('phone')}
      />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        defaultValue={initial('email')}
        errors={errors('email')}
      />
      <Button disabled={pending}>{customer ? 'Save customer' : 'Add customer'}</Button>
    </form>
  );
}

export function VehicleForm({
  customerId,
  canAcceptVin,
}: {
  customerId: string;
  canAcceptVin: boolean;
}) {
  const { state, formAction, pending, errors, value } = useFormAction(addVehicle);
  return (
    <form action={formAction} noValidate className="flex flex-col gap-3" aria-label="Add a vehicle">
      <FormMessage state={state?.ok ? { ok: true, message: 'Vehicle added.' } : state} />
      <input type="hidden" name="customerId" value={customerId} />
      <div className="grid grid-cols-3 gap-3">
        <TextField
          label="Year"
          name="year"
          inputMode="numeric"
          defaultValue={value('year')}
          errors={errors('year')}
        />
        <TextField label="Make" name="make" defaultValue={value('make')} errors={errors('make')} />
        <TextField
          label="Model"
          name="model"
          defaultValue={value('model')}
          errors={errors('model')}
        />
      </div>
      <TextField
        label="Description"
        name="description"
        defaultValue={value('description')}
        errors={errors('description')}
      />
      <TextField
        label="VIN (optional)"
        name="vin"
        defaultValue={value('vin')}
        errors={errors('vin')}
      />
      {canAcceptVin ? (
        <CheckboxField
          label="Accept the VIN even if its check digit does not match"
          name="vinOverride"
        />
      ) : null}
      <Button disabled={pending}>Add vehicle</Button>
    </form>
  );
}
