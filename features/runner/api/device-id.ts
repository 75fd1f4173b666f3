import { deviceLabel } from '@/features/ui/device-label';

/** Where this browser keeps its own id, so the record can say which phone confirmed each bolt. */
export const DEVICE_KEY = 'ringpass:device';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
// When storage is refused (private mode, full, blocked) the id lives as long as the page, so one
// session's events still agree on their phone.
let fallback: string | null = null;

/** This phone's id: made once (a random UUID) and kept in localStorage; client-only. */
export function deviceId(): string {
  try {
    const kept = localStorage.getItem(DEVICE_KEY);
    if (kept && UUID.test(kept)) return kept;
    const made = fallback ?? crypto.randomUUID();
    localStorage.setItem(DEVICE_KEY, made);
    return made;
  } catch {
    fallback ??= crypto.randomUUID();
    return fallback;
  }
}

/** This phone's short name, as the lead will read it on the review. */
export const thisDeviceLabel = () => deviceLabel(deviceId())!;
