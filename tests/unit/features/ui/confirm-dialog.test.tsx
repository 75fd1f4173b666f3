// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, it, vi } from 'vitest';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';

function renderRemove(onConfirm: () => void) {
  render(
    <ConfirmDialog
      triggerLabel="Remove from team"
      title="Remove Dana Whitlock?"
      description="They are signed out and cannot sign in again."
      confirmLabel="Remove Dana Whitlock"
      onConfirm={onConfirm}
    />,
  );
}

it('opens from the keyboard with focus on Cancel; Escape closes it without removing anyone', async () => {
  const onConfirm = vi.fn();
  renderRemove(onConfirm);
  const user = userEvent.setup();
  await user.tab();
  expect(screen.getByRole('button', { name: 'Remove from team' })).toHaveFocus();
  await user.keyboard('{Enter}');
  const dialog = screen.getByRole('alertdialog', { name: 'Remove Dana Whitlock?' });
  expect(dialog).toHaveAccessibleDescription('They are signed out and cannot sign in again.');
  expect(screen.getByRole('button', { name: 'Cancel' })).toHaveFocus();
  await user.keyboard('{Escape}');
  expect(screen.queryByRole('alertdialog')).toBeNull();
  expect(onConfirm).not.toHaveBeenCalled();
  expect(screen.getByRole('button', { name: 'Remove from team' })).toHaveFocus();
});

it('Enter on the button that names the action runs it exactly once and closes the dialog', async () => {
  const onConfirm = vi.fn();
  renderRemove(onConfirm);
  const user = userEvent.setup();
  await user.click(screen.getByRole('button', { name: 'Remove from team' }));
  await user.tab();
  const confirm = screen.getByRole('button', { name: 'Remove Dana Whitlock' });
  expect(confirm).toHaveFocus();
  await user.keyboard('{Enter}');
  expect(onConfirm).toHaveBeenCalledTimes(1);
  expect(screen.queryByRole('alertdialog')).toBeNull();
});

it('Cancel by click runs nothing; focus stays trapped in the open dialog', async () => {
  const onConfirm = vi.fn();
  renderRemove(onConfirm);
  const user = userEvent.setup();
  await user.click(screen.getByRole('button', { name: 'Remove from team' }));
  await user.tab();
  await user.tab(); // past the last button: back to Cancel, never out to the page behind
  expect(screen.getByRole('button', { name: 'Cancel' })).toHaveFocus();
  await user.click(screen.getByRole('button', { name: 'Cancel' }));
  expect(screen.queryByRole('alertdialog')).toBeNull();
  expect(onConfirm).not.toHaveBeenCalled();
});
