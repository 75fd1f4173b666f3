/** Service status in words and a shape, never by colour alone. */
export function StatusBadge({ status }: { status: 'in_service' | 'out_of_service' }) {
  return status === 'in_service' ? (
    <span className="border-ok bg-ok-tint text-ok inline-flex items-center gap-1 rounded-full border-2 px-3 py-0.5 text-sm font-bold">
      <span aria-hidden>●</span>
      <span>In service</span>
    </span>
  ) : (
    <span className="border-danger bg-danger-tint text-danger inline-flex items-center gap-1 rounded-full border-2 px-3 py-0.5 text-sm font-bold">
      <span aria-hidden>■</span>
      <span>Out of service</span>
    </span>
  );
}
