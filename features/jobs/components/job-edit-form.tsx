'use client';

import { Button } from '@/features/ui/button';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { updateJobCard } from '../actions/job-actions';
import type { JobCard } from '../server/jobs';

const localInput = (iso: string | null) => {
  if (!iso) return '';
  const d = new Date(iso);
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
};

export function JobEditForm({ job, assignees }: { job: JobCard; assignees: { id: string; name: string }[] }) {
  const { state, formAction, pending, errors } = useFormAction(updateJobCard);
  return (
    <form
      action={(f) => {
        const due = String(f.get('dueLocal') ?? '');
        f.set('dueAt', due ? new Date(due).toISOString() : '');
        formAction(f);
      }}
      noValidate
      className="flex flex-col gap-3"
      aria-label="Edit the job card"
    >
      <FormMessage state={state?.ok ? { ok: true, message: 'Saved.' } : state} />
      <input type="hidden" name="jobId" value={job.id} />
      <SelectField label="Assigned to" name="assigneeId" defaultValue={job.assignee?.id ?? ''} options={[{ value: '', label: 'Nobody yet' }, ...assignees.map((a) => ({ value: a.id, label: a.name }))]} errors={errors('assigneeId')} />
      <TextField label="Due" name="dueLocal" type="datetime-local" defaultValue={localInput(job.dueAt)} errors={errors('dueAt')} />
      <TextField label="Notes" name="notes" defaultValue={job.notes} errors={errors('notes')} />
      <Button disabled={pending}>Save</Button>
    </form>
  );
}
