import { describe, expect, it } from 'vitest';
import { inviteMail } from '@/features/accounts/server/invite-mail';

describe('invite e-mail', () => {
  it("gives the expiry on the shop's clock, with its zone spelled out, never as UTC", () => {
    const mail = inviteMail({
      shopName: 'Ridge Tire',
      inviterName: 'Lena Lead',
      role: 'technician',
      link: 'http://127.0.0.1:3000/invite/t',
      expiresAt: new Date('2026-12-09T06:30:00Z'),
      timeZone: 'America/Denver',
    });
    expect(mail.text).toContain('expires December 8, 2026 at 11:30 PM Mountain Standard Time.');
    expect(mail.html).toContain('expires December 8, 2026 at 11:30 PM Mountain Standard Time.');
    expect(mail.text).not.toMatch(/UTC|GMT/);
  });
});
