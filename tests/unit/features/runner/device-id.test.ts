// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEVICE_KEY, deviceId, thisDeviceLabel } from '@/features/runner/api/device-id';
import { clientEventSchema } from '@/features/runner/events';
import { deviceLabel } from '@/features/ui/device-label';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

describe("a phone's own id", () => {
  afterEach(() => {
    vi.restoreAllMocks();
    localStorage.clear();
  });

  it('is made once and kept under ringpass:device, so every later event names the same phone', () => {
    const first = deviceId();
    expect(first).toMatch(UUID);
    expect(localStorage.getItem(DEVICE_KEY)).toBe(first);
    expect(deviceId()).toBe(first);
  });

  it('a kept value that is not an id is replaced, not sent', () => {
    localStorage.setItem(DEVICE_KEY, 'not-a-phone');
    expect(deviceId()).toMatch(UUID);
    expect(localStorage.getItem(DEVICE_KEY)).toMatch(UUID);
  });

  it('with storage refused (private mode) the page still has one steady id', () => {
    vi.spyOn(Storage.prototype, 'getItem').mockImplementation(() => {
      throw new Error('SecurityError');
    });
    const a = deviceId();
    expect(a).toMatch(UUID);
    expect(deviceId()).toBe(a);
  });

  it('reads as "Phone" and the id\'s first four hex digits, the same words the review shows', () => {
    expect(deviceLabel('3f9a0c1e-2b4d-4e6f-8a9b-0c1d2e3f4a5b')).toBe('Phone 3F9A');
    expect(deviceLabel(null)).toBeNull();
    expect(deviceLabel(undefined)).toBeNull();
    expect(deviceLabel('')).toBeNull();
    localStorage.setItem(DEVICE_KEY, '0a1b2c3d-0000-4000-8000-000000000000');
    expect(thisDeviceLabel()).toBe('Phone 0A1B');
  });

  it('the event schema takes a phone id beside the event id, or none (events queued before an update), and refuses a bad one', () => {
    const event = {
      type: 'hand_started',
      payload: { bolt: 1 },
      clientId: crypto.randomUUID(),
      clientAt: '2026-01-01T09:00:00.000Z',
    };
    expect(clientEventSchema.safeParse(event).success).toBe(true);
    expect(
      clientEventSchema.parse({ ...event, deviceId: '3f9a0c1e-2b4d-4e6f-8a9b-0c1d2e3f4a5b' }),
    ).toMatchObject({ deviceId: '3f9a0c1e-2b4d-4e6f-8a9b-0c1d2e3f4a5b' });
    const bad = clientEventSchema.safeParse({ ...event, deviceId: 'phone-1' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toBe('The phone id is not valid.');
  });
});
