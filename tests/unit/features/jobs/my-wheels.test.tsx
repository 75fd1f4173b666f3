// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { MyWheels } from '@/features/jobs/components/my-wheels';
import type { MyWheel } from '@/features/jobs/server/my-wheels';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';

const wheel: MyWheel = {
  jobId: 'job-1',
  jobNumber: 1042,
  wheelId: 'wheel-1',
  position: 'RF',
  customer: 'Wren Halloway',
  vehicle: '2022 Talonworks Ridgeback',
  tireSize: '30x10R15',
  specName: '24-bolt ring',
  dueAt: '2030-01-01T17:30:00.000Z',
  status: 'sent_back',
  reworkNote: 'Re-seat the bead',
};

const show = (wheels: MyWheel[]) =>
  render(
    <ShopTimeZoneProvider timeZone="America/Denver">
      <MyWheels wheels={wheels} />
    </ShopTimeZoneProvider>,
  );

describe('My wheels', () => {
  it('makes each wheel one link to its runner, with what a technician needs to pick it up, due on the shop’s clock', () => {
    show([wheel]);
    const link = screen.getByRole('link', { name: /Job #1042 · Right front/ });
    expect(link).toHaveAttribute('href', '/jobs/job-1/wheels/wheel-1/run');
    expect(link).toHaveTextContent('Sent back');
    expect(link).toHaveTextContent('Wren Halloway · 2022 Talonworks Ridgeback');
    expect(link).toHaveTextContent('Tire 30x10R15 · Spec 24-bolt ring');
    expect(link).toHaveTextContent('Lead’s note: Re-seat the bead');
    // 17:30 UTC is 10:30 in Denver in January (MST, UTC−7).
    expect(link).toHaveTextContent('Due Jan 1, 2030, 10:30 AM');
  });

  it('with nothing assigned, says so and points to the board', () => {
    show([]);
    expect(screen.getByRole('heading', { name: 'No wheels waiting for you' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Open the board' })).toHaveAttribute('href', '/board');
  });
});
