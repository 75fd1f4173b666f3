'use client';

import { Button } from '@/features/ui/button';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { zoneLabel } from '@/features/ui/shop-time';
import { useShopTime } from '@/features/ui/shop-time-zone';
import { useFormAction } from '@/features/ui/use-form-action';
import { updateJobCard } from '../actions/job-actions';
import type { JobCard } from '../server/jobs';

export function JobEditForm({
  job,
  assignees,
}: {
  job: JobCard;
  assignees: { id: string; name: string }[];
}) {
  const { state, formAction, pending, errors } = useFormAction(updateJobCard);
  // The due time is typed on the shop's clock, whatever zone the phone or the server is in.
  const clock = useShopTime();
  return (
    <form
      action={(f) => {
        const due = String(f.get('dueLocal') ?? '');
        f.set('dueAt', clock.fromLocalInput(due));
        formAction(f);
      }}
      noValidate
      className="flex flex-col gap-3"
      aria-label="Edit the job card"
    >
      <FormMessage state={state?.ok ? { ok: true, message: 'Saved.' } : state} />
      <input type="hidden" name="jobId" value={job.id} />
      <SelectField
        label="Assigned to"
        name="assigneeId"
        defaultValue={job.assignee?.id ?? ''}
        options={[
          { value: '', label: 'Nobody yet' },
          ...assignees.map((a) => ({ value: a.id, label: a.name })),
        ]}
        errors={errors('assigneeId')}
      />
      <TextField
        label="Due"
        name="dueLocal"
        type="datetime-local"
        defaultValue={clock.toLocalInput(job.dueAt)}
        hint={`Shop time: ${zoneLabel(clock.timeZone)}.`}
        errors={errors('dueAt')}
      />
      <TextField label="Notes" name="notes" defaultValue={job.notes} errors={errors('notes')} />
      <Button disabled={pending}>Save</Button>
    </form>
  );
}
