// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { JobCardPrint } from '@/features/jobs/components/job-card-print';
import { runnerUrl, type PrintedWheel } from '@/features/jobs/server/job-card-print';
import type { JobCard } from '@/features/jobs/server/jobs';
import { qrSvg } from '@/features/ui/qr-svg';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';

const JOB_ID = '7f1c2b9e-0a4d-4c1e-9a3b-2d5e6f708192';

const job: JobCard = {
  id: JOB_ID,
  number: 1042,
  state: 'open',
  customer: { id: 'c1', name: 'Wren Halloway', phone: '555-0142', email: '' },
  vehicle: {
    id: 'v1',
    customerId: 'c1',
    year: 2022,
    make: 'Talonworks',
    model: 'Ridgeback',
    description: '',
    vin: '1TW4R9XK2NB000421',
    vinCheckOverridden: false,
    label: '2022 Talonworks Ridgeback',
  },
  assignee: { id: 'u1', name: 'Tia Tread' },
  // 17:30 UTC is 10:30 AM in Denver (UTC−7 in January).
  dueAt: '2030-01-15T17:30:00.000Z',
  dismount: true,
  reinstall: false,
  notes: '',
  createdAt: '2030-01-14T17:30:00.000Z',
  updatedAt: '2030-01-14T17:30:00.000Z',
  wheels: [],
  events: [],
  warnings: [],
};

async function wheel(
  id: string,
  position: PrintedWheel['position'],
  patch: Partial<PrintedWheel> = {},
): Promise<PrintedWheel> {
  const url = runnerUrl(JOB_ID, id, 'https://shop.ringpass.test');
  return {
    id,
    position,
    spec: {
      name: '24-bolt sand ring',
      boltCount: 24,
      boltThread: 'M8×1.25',
      pattern: { kind: 'cross', step: null },
      finalTorque: { value: 12, unit: 'lbf-ft' },
      threadCondition: 'dry',
      makerReference: 'Ring manual rev. C, p. 4',
      flag: null,
    },
    tireSize: '30x10R14',
    directional: false,
    targetPressure: { value: 12, unit: 'psi' },
    runnerUrl: url,
    qrSvg: await qrSvg(url),
    ...patch,
  };
}

const show = (wheels: PrintedWheel[]) =>
  render(
    <ShopTimeZoneProvider timeZone="America/Denver">
      <JobCardPrint job={job} wheels={wheels} />
    </ShopTimeZoneProvider>,
  );

describe('printed job card', () => {
  it('builds the runner link on the app’s public address', () => {
    expect(runnerUrl(JOB_ID, 'w-1', 'https://shop.ringpass.test')).toBe(
      `https://shop.ringpass.test/jobs/${JOB_ID}/wheels/w-1/run`,
    );
  });

  it('heads the card with the job, customer, vehicle with VIN and the due time on the shop’s clock', async () => {
    show([await wheel('w-1', 'LF')]);
    expect(screen.getByRole('heading', { name: 'Job card #1042' })).toBeInTheDocument();
    expect(screen.getByText('Wren Halloway · 555-0142')).toBeInTheDocument();
    expect(
      screen.getByText('2022 Talonworks Ridgeback · VIN 1TW4R9XK2NB000421'),
    ).toBeInTheDocument();
    expect(screen.getByText('Jan 15, 2030, 10:30 AM')).toBeInTheDocument();
  });

  it('gives every wheel its own card with its spec, tire, pressure and a QR code to its runner', async () => {
    const wheels = [
      await wheel('w-lf', 'LF'),
      await wheel('w-rf', 'RF', {
        directional: true,
        spec: {
          name: '16-bolt trail ring',
          boltCount: 16,
          boltThread: '5/16-18',
          pattern: { kind: 'skip', step: 5 },
          finalTorque: { value: 20, unit: 'Nm' },
          threadCondition: null,
          makerReference: '',
          flag: null,
        },
        targetPressure: { value: 100, unit: 'kPa' },
      }),
    ];
    show(wheels);
    const cards = screen.getAllByRole('article');
    expect(cards).toHaveLength(2);

    const lf = within(screen.getByRole('article', { name: 'LF · Left front' }));
    expect(lf.getByText('24-bolt sand ring')).toBeInTheDocument();
    expect(lf.getByText('24 × M8×1.25, cross pattern')).toBeInTheDocument();
    expect(lf.getByText('12 ft-lb')).toBeInTheDocument();
    expect(lf.getByText('Ring manual rev. C, p. 4')).toBeInTheDocument();
    expect(lf.getByText('30x10R14 · not directional')).toBeInTheDocument();
    expect(lf.getByText('12 psi target')).toBeInTheDocument();

    const rf = within(screen.getByRole('article', { name: 'RF · Right front' }));
    expect(rf.getByText('16 × 5/16-18, skip 5 pattern')).toBeInTheDocument();
    expect(rf.getByText('20 N·m')).toBeInTheDocument();
    expect(
      rf.getByText(
        '30x10R14 · directional: seen from outside, the arrow turns clockwise (right side)',
      ),
    ).toBeInTheDocument();
    expect(rf.getByText(/Not stated in this spec/)).toBeInTheDocument();
    expect(rf.getByText('100 kPa target')).toBeInTheDocument();

    for (const [i, w] of wheels.entries()) {
      const card = within(cards[i]!);
      const code = card.getByRole('img', { name: /^QR code: opens the runner for the .* wheel$/ });
      const svg = code.querySelector('svg');
      expect(svg, `${w.position} has its QR drawing`).not.toBeNull();
      // The drawing is the one made for this wheel's runner link (its dark modules' path).
      const drawn = svg!.querySelector('path[stroke]')!.getAttribute('d');
      expect(drawn).toBe(/<path stroke="#000000" d="([^"]+)"/.exec(await qrSvg(w.runnerUrl))![1]);
    }
    expect(wheels[0]!.qrSvg).not.toBe(wheels[1]!.qrSvg);
  });

  it('tells the reader a flagged spec will not run', async () => {
    show([
      await wheel('w-1', 'LR', {
        spec: { ...(await wheel('x', 'LR')).spec, flag: 'Bead-seating limit above 40 psi' },
      }),
    ]);
    expect(
      screen.getByText(/Spec flagged: the runner will not start this wheel/),
    ).toBeInTheDocument();
  });
});
