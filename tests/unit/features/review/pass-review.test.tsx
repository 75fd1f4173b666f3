// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { PassReview } from '@/features/review/components/pass-review';
import { wheelRecord } from '@/features/review/record';
import type { ReviewEvent } from '@/features/review/types';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';

const TECH = 'b1c2d3e4-0000-4000-8000-000000000001';
const event = (bolt: number, second: number, deviceId?: string | null): ReviewEvent => ({
  clientId: `00000000-0000-4000-8000-00000000000${bolt}`,
  type: 'bolt_confirmed',
  payload: { pass: 1, bolt },
  clientAt: `2026-03-02T14:00:0${second}.000Z`,
  receivedAt: `2026-03-02T14:00:0${second}.000Z`,
  byId: TECH,
  deviceId,
  superseded: false,
});

describe("the review's per-bolt table", () => {
  it("names each bolt's time, person and phone, and says when an older event has no phone", () => {
    const plan = {
      boltCount: 2,
      steps: [],
      passes: [
        {
          index: 1,
          kind: 'check' as const,
          fraction: 1,
          target: { value: 100, unit: 'lbf-ft' as const },
          order: [1, 2],
        },
      ],
    };
    const record = wheelRecord(plan, [
      event(1, 0, '3f9a0c1e-2b4d-4e6f-8a9b-0c1d2e3f4a5b'),
      event(2, 4),
    ]);
    render(
      <ShopTimeZoneProvider timeZone="UTC">
        <PassReview
          pass={record.passes[0]!}
          passCount={1}
          boltCount={2}
          uses={[]}
          people={{ [TECH]: 'Theo Tech' }}
        />
      </ShopTimeZoneProvider>,
    );
    const table = screen.getByRole('table');
    expect(
      within(table)
        .getAllByRole('columnheader')
        .map((th) => th.textContent),
    ).toEqual(['#', 'Bolt', 'Plan', 'When', 'Gap', 'By', 'Phone']);
    const rows = within(table)
      .getAllByRole('row')
      .slice(1)
      .map((tr) =>
        within(tr)
          .getAllByRole('cell')
          .map((td) => td.textContent),
      );
    expect(rows.map((r) => [r[1], r[5], r[6]])).toEqual([
      ['1', 'Theo Tech', 'Phone 3F9A'],
      ['2', 'Theo Tech', 'not recorded'],
    ]);
  });
});
