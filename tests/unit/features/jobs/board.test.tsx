// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

let search = new URLSearchParams();
const replace = vi.fn((url: string) => {
  search = new URLSearchParams(url.split('?')[1]);
});
vi.mock('next/navigation', () => ({
  useRouter: () => ({ replace }),
  usePathname: () => '/board',
  useSearchParams: () => search,
}));

const { Board } = await import('@/features/jobs/components/board');
const { ShopTimeZoneProvider } = await import('@/features/ui/shop-time-zone');

const row = {
  id: 'j1',
  number: 1042,
  state: 'in_progress',
  customer: 'Wren Halloway',
  vehicle: '2022 Talonworks Ridgeback',
  wheelCount: 4,
  assignee: { id: 't1', name: 'Theo Tech' },
  dueAt: '2030-01-01T10:00:00.000Z',
  updatedAt: '2030-01-01T09:00:00.000Z',
};
const fetchMock = vi.fn(async (url: string) => {
  const empty = url.includes('q=nothing');
  return new Response(
    JSON.stringify({ data: empty ? [] : [row], page: 1, pageSize: 25, total: empty ? 0 : 1 }),
    { status: 200 },
  );
});

function renderBoard(
  props: Partial<Parameters<typeof Board>[0]> = {},
  timeZone = 'America/Denver',
) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <ShopTimeZoneProvider timeZone={timeZone}>
      <QueryClientProvider client={client}>
        <Board people={[{ id: 't1', name: 'Theo Tech' }]} canCreate {...props} />
      </QueryClientProvider>
    </ShopTimeZoneProvider>,
  );
}

beforeEach(() => {
  search = new URLSearchParams();
  replace.mockClear();
  fetchMock.mockClear();
  vi.stubGlobal('fetch', fetchMock);
});
afterEach(() => vi.unstubAllGlobals());

describe('Board', () => {
  it("shows the due time on the shop's clock, whatever zone the browser is in", async () => {
    const view = renderBoard();
    const row = await screen.findByRole('row', { name: /Wren Halloway/ });
    expect(row).toHaveTextContent('Jan 1, 2030, 3:00 AM'); // 10:00 UTC is 03:00 MST
    expect(row).not.toHaveTextContent(/UTC|GMT/);
    view.unmount();
    renderBoard({}, 'Europe/Berlin');
    expect(await screen.findByRole('row', { name: /Wren Halloway/ })).toHaveTextContent(
      'Jan 1, 2030, 11:00 AM',
    );
  });

  it('shows the jobs the API returns, with a link to each card', async () => {
    renderBoard();
    expect(await screen.findByRole('link', { name: '#1042' })).toHaveAttribute('href', '/jobs/j1');
    expect(screen.getByRole('row', { name: /Wren Halloway/ })).toHaveTextContent('In progress');
    expect(fetchMock.mock.calls[0]![0]).toBe('/api/jobs?');
  });

  it('puts each filter in the URL and asks the API for it', async () => {
    const view = renderBoard();
    await screen.findByRole('link', { name: '#1042' });
    await userEvent.selectOptions(screen.getByLabelText('State'), 'awaiting_signoff');
    expect(replace).toHaveBeenLastCalledWith('/board?state=awaiting_signoff', { scroll: false });
    view.rerender(
      <ShopTimeZoneProvider timeZone="America/Denver">
        <QueryClientProvider client={new QueryClient()}>
          <Board people={[{ id: 't1', name: 'Theo Tech' }]} canCreate />
        </QueryClientProvider>
      </ShopTimeZoneProvider>,
    );
    await waitFor(() =>
      expect(
        fetchMock.mock.calls.some(([u]) => String(u) === '/api/jobs?state=awaiting_signoff'),
      ).toBe(true),
    );
    await userEvent.selectOptions(screen.getByLabelText('Due'), 'overdue');
    expect(replace).toHaveBeenLastCalledWith('/board?state=awaiting_signoff&due=overdue', {
      scroll: false,
    });
  });

  it('sorts by a column from its header button, announced with aria-sort', async () => {
    renderBoard();
    await screen.findByRole('link', { name: '#1042' });
    expect(screen.getByRole('columnheader', { name: /Due/ })).toHaveAttribute(
      'aria-sort',
      'ascending',
    );
    await userEvent.click(screen.getByRole('button', { name: /Customer/ }));
    expect(replace).toHaveBeenLastCalledWith('/board?sort=customer&dir=asc', { scroll: false });
  });

  it('waits for a pause in typing before searching', async () => {
    renderBoard();
    await screen.findByRole('link', { name: '#1042' });
    await userEvent.type(screen.getByLabelText('Search'), 'Wren');
    expect(replace).not.toHaveBeenCalledWith(expect.stringContaining('q=W&'), expect.anything());
    await waitFor(() =>
      expect(replace).toHaveBeenLastCalledWith('/board?q=Wren', { scroll: false }),
    );
  });

  it("a technician's default is their own work, with a clear empty state", async () => {
    search = new URLSearchParams('q=nothing');
    renderBoard({ defaultAssignee: 'me' });
    expect(await screen.findByText('No job cards match these filters')).toBeInTheDocument();
    expect(fetchMock.mock.calls[0]![0]).toBe('/api/jobs?assignee=me&q=nothing');
  });
});
