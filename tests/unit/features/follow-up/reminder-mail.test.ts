import { describe, expect, it } from 'vitest';
import { bothUnits, recheckReminderMail } from '@/features/follow-up/reminder-mail';

const facts = {
  shopName: 'Canyon Bead & Bolt',
  customer: 'Wren Halloway',
  vehicle: '2022 Talonworks Ridgeback',
  jobNumber: 1042,
  dueOn: '2026-12-08',
  dueText: 'Dec 8, 2026',
  wheels: [
    {
      position: 'Left front',
      boltCount: 8,
      sequence: [1, 5, 3, 7, 2, 6, 4, 8],
      finalTorque: { value: 20, unit: 'lbf-ft' as const },
      makerReference: 'RB-8 sheet rev C',
    },
  ],
};

describe('the re-check reminder e-mail', () => {
  it('names every ring bolt’s final torque in both units, in the sequence, with the maker’s reference', () => {
    const mail = recheckReminderMail(facts);
    // NIST SP 811 App. B: 1 ft·lbf = 1.355 818 N·m, so 20 ft-lb = 27.1 N·m.
    expect(mail.text).toContain(
      'Left front: all 8 ring bolts at 20 ft-lb (27.1 N·m), in this order: 1-5-3-7-2-6-4-8',
    );
    expect(mail.text).toContain("maker's reference: RB-8 sheet rev C");
    expect(mail.text).toContain('due Dec 8, 2026');
    expect(mail.subject).toContain('Canyon Bead & Bolt');
  });

  it('puts the maker’s specs, local codes and licensed practice first, in text and HTML', () => {
    const mail = recheckReminderMail(facts);
    for (const body of [mail.text, mail.html])
      expect(body).toMatch(/maker(&#39;|')s specs, local codes and licensed practice come first/);
    expect(mail.html).toContain('Canyon Bead &amp; Bolt');
    expect(mail.html).not.toContain('Canyon Bead & Bolt');
  });

  it('tells the shop to call when the customer has no address', () => {
    const mail = recheckReminderMail({ ...facts, forShop: true });
    expect(mail.subject).toContain('no customer e-mail on file');
    expect(mail.text).toContain('give them a call');
  });

  it('converts N·m to ft-lb and in-lb to N·m', () => {
    expect(bothUnits({ value: 100, unit: 'Nm' })).toBe('100 N·m (73.8 ft-lb)');
    // NIST SP 811 App. B: 1 in·lbf = 0.112 984 8 N·m, so 200 in-lb = 22.6 N·m.
    expect(bothUnits({ value: 200, unit: 'lbf-in' })).toBe('200 in-lb (22.6 N·m)');
  });
});
