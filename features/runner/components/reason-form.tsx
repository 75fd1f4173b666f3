'use client';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';

/** A reason in words before a step is skipped or the wheel is stopped: at least three characters. */
export function ReasonForm({
  label,
  value,
  setValue,
  submit,
  onSubmit,
  onCancel,
}: {
  label: string;
  value: string;
  setValue: (v: string) => void;
  submit: string;
  onSubmit: () => void;
  onCancel: () => void;
}) {
  return (
    <div className="border-ink flex flex-col gap-2 rounded-xl border-2 p-3">
      <label htmlFor="reason" className="font-semibold">
        {label}
      </label>
      <input
        id="reason"
        value={value}
        onChange={(e) => setValue(e.target.value)}
        className="border-ink-soft min-h-14 rounded-xl border-2 px-3 text-lg"
      />
      <div className="grid grid-cols-2 gap-2">
        <button type="button" onClick={onCancel} className={`${big} border-ink border-2`}>
          Cancel
        </button>
        <button
          type="button"
          disabled={value.trim().length < 3}
          onClick={onSubmit}
          className={`${big} bg-ink text-white disabled:opacity-40`}
        >
          {submit}
        </button>
      </div>
    </div>
  );
}
