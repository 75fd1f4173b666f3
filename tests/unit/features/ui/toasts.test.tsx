// @vitest-environment jsdom
import { act, render, screen } from '@testing-library/react';
import { expect, it } from 'vitest';
import { FormMessage } from '@/features/ui/form-message';
import { ToastRegion } from '@/features/ui/toasts';

type State = { ok: boolean; message?: string } | null;

function Page({
  state,
  pending,
  region = true,
}: {
  state: State;
  pending: boolean;
  region?: boolean;
}) {
  const body = <FormMessage state={state} pending={pending} />;
  return region ? <ToastRegion>{body}</ToastRegion> : body;
}

const toasts = () => document.querySelectorAll('[data-sonner-toast]');

it('a saved form shows its message inline and once as a toast, not again on a re-render', async () => {
  const saved = { ok: true, message: 'Spec saved.' };
  const { rerender } = render(<Page state={null} pending={false} />);
  rerender(<Page state={null} pending={true} />);
  rerender(<Page state={saved} pending={false} />);
  expect(screen.getByRole('status')).toHaveTextContent('Spec saved.');
  await act(() => new Promise((r) => setTimeout(r, 50)));
  expect(toasts()).toHaveLength(1);
  expect(toasts()[0]).toHaveTextContent('Spec saved.');

  rerender(<Page state={{ ...saved }} pending={false} />); // a re-render is not a new result
  await act(() => new Promise((r) => setTimeout(r, 50)));
  expect(toasts()).toHaveLength(1);
});

it('a refusal toasts as an error beside the inline alert', async () => {
  const { rerender } = render(<Page state={null} pending={true} />);
  rerender(
    <Page state={{ ok: false, message: 'Your role does not allow this.' }} pending={false} />,
  );
  expect(screen.getByRole('alert')).toHaveTextContent('Your role does not allow this.');
  await act(() => new Promise((r) => setTimeout(r, 50)));
  const toast = [...toasts()].find((t) =>
    t.textContent?.includes('Your role does not allow this.'),
  );
  expect(toast).toHaveAttribute('data-type', 'error');
});

it('outside a ToastRegion (the runner, sign-in) nothing toasts', async () => {
  const { rerender } = render(<Page state={null} pending={true} region={false} />);
  rerender(<Page state={{ ok: true, message: 'Saved.' }} pending={false} region={false} />);
  await act(() => new Promise((r) => setTimeout(r, 50)));
  expect(screen.getByRole('status')).toHaveTextContent('Saved.');
  expect(toasts()).toHaveLength(0);
});
