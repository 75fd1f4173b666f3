/** A time as a lead reads it: "1.2 s" under ten seconds (the too-fast rule lives there), "45 s", "3 min 20 s", "1 h 5 min". */
export function formatSeconds(seconds: number): string {
  if (seconds < 10) return `${Number(Math.max(0, seconds).toFixed(1))} s`;
  const s = Math.round(seconds);
  if (s < 60) return `${s} s`;
  const minutes = Math.floor(s / 60);
  if (minutes < 60) return s % 60 ? `${minutes} min ${s % 60} s` : `${minutes} min`;
  return minutes % 60
    ? `${Math.floor(minutes / 60)} h ${minutes % 60} min`
    : `${Math.floor(minutes / 60)} h`;
}
