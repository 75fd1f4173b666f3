/** A stored spec that fails the plausibility rules: why, and what it blocks until a lead fixes it. */
export function SpecFlag({ reason, canFix }: { reason: string; canFix: boolean }) {
  return (
    <div role="alert" className="border-danger bg-danger-tint text-danger rounded-lg border-2 p-3">
      <p className="font-bold">Flagged: the runner will not start a wheel on this spec.</p>
      <p>{reason}</p>
      <p className="text-sm">
        {canFix
          ? "Correct the numbers from the wheel and tire maker's figures and save: a spec that passes every check is cleared."
          : 'Ask a lead to correct it from the wheel and tire maker’s figures.'}
      </p>
    </div>
  );
}
