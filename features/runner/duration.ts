/** A step's time as a lead reads it: "45 s", "3 min 20 s", "1 h 5 min". */
export function formatDuration(ms: number): string {
  const seconds = Math.max(0, Math.round(ms / 1000));
  if (seconds < 60) return `${seconds} s`;
  const minutes = Math.floor(seconds / 60);
  if (minutes < 60) return seconds % 60 ? `${minutes} min ${seconds % 60} s` : `${minutes} min`;
  return minutes % 60
    ? `${Math.floor(minutes / 60)} h ${minutes % 60} min`
    : `${Math.floor(minutes / 60)} h`;
}
