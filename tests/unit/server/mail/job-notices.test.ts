import { describe, expect, it } from 'vitest';
import { awaitingSignoffMail, sentBackMail } from '@/server/mail/job-notices';

const job = { number: 1042, customer: 'Wren <Halloway>', vehicle: '2022 Talonworks Ridgeback' };

describe('sign-off notices', () => {
  it('tells a lead in plain text and HTML which job waits and where to review it, escaping what people typed', () => {
    const mail = awaitingSignoffMail({
      ...job,
      by: 'Theo Tech',
      link: 'http://127.0.0.1:3000/jobs/j1/review',
    });
    expect(mail.subject).toBe('Job 1042 is waiting for sign-off');
    expect(mail.text).toContain(
      'Theo Tech submitted job 1042 (Wren <Halloway>, 2022 Talonworks Ridgeback) for sign-off.',
    );
    expect(mail.html).toContain(
      '<strong>job 1042 (Wren &lt;Halloway&gt;, 2022 Talonworks Ridgeback)</strong>',
    );
    expect(mail.html).toContain(
      '<a href="http://127.0.0.1:3000/jobs/j1/review">Review job 1042</a>',
    );
  });

  it('tells the technician each wheel sent back with its note and the steps to redo', () => {
    const mail = sentBackMail({
      ...job,
      by: 'Lena Lead',
      link: 'http://127.0.0.1:3000/jobs/j1',
      wheels: [
        { position: 'LF', note: 'Redo pass 2 & the check pass.', steps: ['torque'] },
        { position: 'RR', note: 'Inner bead photo is blurred.', steps: [] },
      ],
    });
    expect(mail.subject).toBe('Job 1042 was sent back: LF, RR');
    expect(mail.text.split('\n')).toEqual(
      expect.arrayContaining([
        'LF wheel: Redo pass 2 & the check pass. (redo: torque)',
        'RR wheel: Inner bead photo is blurred. (redo the whole wheel)',
      ]),
    );
    expect(mail.html).toContain(
      '<li><strong>LF wheel:</strong> Redo pass 2 &amp; the check pass. (redo: torque)</li>',
    );
  });
});
