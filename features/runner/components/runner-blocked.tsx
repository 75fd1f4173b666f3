import Link from 'next/link';

/** Shown instead of the runner when the wheel's spec is flagged: nothing on this wheel is started. */
export function RunnerBlocked({
  jobId,
  jobNumber,
  specId,
  message,
}: {
  jobId: string;
  jobNumber: number;
  specId: string;
  message: string;
}) {
  return (
    <main className="mx-auto flex max-w-xl flex-col gap-4 p-4">
      <h1 className="text-2xl font-bold">Job {jobNumber}: this wheel cannot be run yet</h1>
      <div
        role="alert"
        className="border-danger bg-danger-tint text-danger rounded-lg border-2 p-4"
      >
        <p className="font-bold">{message}</p>
        <p className="mt-2">
          Do not seat or inflate this tire from these numbers. A lead corrects the spec from the
          wheel and tire maker&apos;s figures; then the runner opens.
        </p>
      </div>
      <p className="flex flex-wrap gap-4">
        <Link href={`/specs/${specId}`} className="text-work font-semibold underline">
          Open the spec
        </Link>
        <Link href={`/jobs/${jobId}`} className="text-work font-semibold underline">
          ← Back to the job card
        </Link>
      </p>
    </main>
  );
}
