// @vitest-environment jsdom
// A lead's customer links on a signed-off job: Revoke asks first and names which link, and "Copied"
// is said only when the clipboard really took the link.
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { CustomerLinks, type LinkRow } from '@/features/reports/components/customer-links';

const actions = vi.hoisted(() => ({
  createCustomerLink: vi.fn(),
  revokeCustomerLink: vi.fn(),
}));
vi.mock('@/features/reports/actions/report-link-actions', () => actions);

const JOB = '5b2e8c1d-7f3a-4d6e-9b0c-2a1f3e4d5c6b';
const links: LinkRow[] = [
  { id: 'link-a', created: '1 Dec, 16:02', expires: '31 Dec' },
  { id: 'link-b', created: '2 Dec, 10:14', expires: '1 Jan' },
];

/** Puts a clipboard in place (user-event installs its own stub at setup, so this comes after). */
function clipboard(writeText: (text: string) => Promise<void>) {
  const spy = vi.fn(writeText);
  Object.defineProperty(navigator, 'clipboard', { configurable: true, value: { writeText: spy } });
  return spy;
}

describe('customer links', () => {
  beforeEach(() => {
    actions.createCustomerLink.mockReset();
    actions.revokeCustomerLink.mockReset();
    actions.revokeCustomerLink.mockResolvedValue({ ok: true, data: { revoked: true } });
    actions.createCustomerLink.mockResolvedValue({
      ok: true,
      data: { url: 'https://ringpass.test/r/9f2c' },
    });
  });

  it('each Revoke names its link, and nothing is revoked until the lead confirms', async () => {
    const user = userEvent.setup();
    render(<CustomerLinks jobId={JOB} links={links} />);
    expect(
      screen.getAllByRole('button', { name: /^Revoke/ }).map((b) => b.getAttribute('aria-label')),
    ).toEqual(['Revoke the link made 1 Dec, 16:02', 'Revoke the link made 2 Dec, 10:14']);

    await user.click(screen.getByRole('button', { name: 'Revoke the link made 2 Dec, 10:14' }));
    const dialog = screen.getByRole('alertdialog', { name: 'Revoke this customer link?' });
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(actions.revokeCustomerLink).not.toHaveBeenCalled();

    await user.click(screen.getByRole('button', { name: 'Revoke the link made 2 Dec, 10:14' }));
    await user.click(
      within(screen.getByRole('alertdialog')).getByRole('button', {
        name: 'Revoke the link made 2 Dec, 10:14',
      }),
    );
    await screen.findByText('Link revoked: it no longer opens the report.');
    expect(actions.revokeCustomerLink).toHaveBeenCalledTimes(1);
    expect(actions.revokeCustomerLink).toHaveBeenCalledWith(null, { linkId: 'link-b' });
  });

  it('two links made the same minute still get different names', () => {
    render(
      <CustomerLinks
        jobId={JOB}
        links={[links[1]!, { id: 'link-c', created: '2 Dec, 10:14', expires: '1 Jan' }]}
      />,
    );
    expect(
      screen.getAllByRole('button', { name: /^Revoke/ }).map((b) => b.getAttribute('aria-label')),
    ).toEqual([
      'Revoke the link made 2 Dec, 10:14 (1 of 2)',
      'Revoke the link made 2 Dec, 10:14 (2 of 2)',
    ]);
  });

  it('says "Copied" once the clipboard took the link', async () => {
    const user = userEvent.setup();
    const writeText = clipboard(async () => {});
    render(<CustomerLinks jobId={JOB} links={[]} />);
    await user.click(screen.getByRole('button', { name: 'New customer link' }));
    await user.click(await screen.findByRole('button', { name: 'Copy link' }));
    await screen.findByRole('button', { name: 'Copied' });
    expect(writeText).toHaveBeenCalledWith('https://ringpass.test/r/9f2c');
  });

  it('when the clipboard refuses, never says "Copied" and asks to copy it by hand', async () => {
    const user = userEvent.setup();
    clipboard(async () => {
      throw new DOMException('Write permission denied.', 'NotAllowedError');
    });
    render(<CustomerLinks jobId={JOB} links={[]} />);
    await user.click(screen.getByRole('button', { name: 'New customer link' }));
    await user.click(await screen.findByRole('button', { name: 'Copy link' }));
    await screen.findByText('Copy failed — select the link and copy it.');
    expect(screen.queryByRole('button', { name: 'Copied' })).toBeNull();
    await waitFor(() =>
      expect(screen.getByRole('textbox', { name: 'Customer link' })).toHaveFocus(),
    );
  });
});
