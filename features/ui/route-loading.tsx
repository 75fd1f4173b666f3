/** A route group's loading state: short, announced politely, no layout jump. */
export function RouteLoading({ what = 'page' }: { what?: string }) {
  return (
    <p role="status" className="p-4 font-semibold text-ink-soft">
      Loading the {what}…
    </p>
  );
}
