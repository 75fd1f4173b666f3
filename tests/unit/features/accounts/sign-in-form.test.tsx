// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

const signIn = vi.fn();
vi.mock('@/features/accounts/actions/sign-in', () => ({
  signIn: (...args: unknown[]) => signIn(...args),
}));

const { SignInForm } = await import('@/features/accounts/components/sign-in-form');

describe('SignInForm', () => {
  it('shows the server message, keeps the e-mail and never echoes the password', async () => {
    signIn.mockResolvedValueOnce({
      ok: false,
      message: 'Wrong e-mail or password.',
      values: { email: 'tech@shop.test' },
    });
    render(<SignInForm />);
    await userEvent.type(screen.getByLabelText('E-mail'), 'tech@shop.test');
    await userEvent.type(screen.getByLabelText('Password'), 'not-it');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Wrong e-mail or password.');
    expect(screen.getByLabelText('E-mail')).toHaveValue('tech@shop.test');
    expect(screen.getByLabelText('Password')).toHaveValue('');
    const form = signIn.mock.calls[0]![1] as FormData;
    expect(form.get('email')).toBe('tech@shop.test');
  });

  it('marks the field with its own error, linked for screen readers', async () => {
    signIn.mockResolvedValueOnce({
      ok: false,
      message: 'Check the highlighted fields.',
      fieldErrors: { email: ['Enter a valid e-mail address, like name@example.com.'] },
    });
    render(<SignInForm />);
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    const email = await screen.findByLabelText('E-mail');
    await vi.waitFor(() => expect(email).toHaveAttribute('aria-invalid', 'true'));
    expect(email).toHaveAccessibleDescription(
      'Enter a valid e-mail address, like name@example.com.',
    );
  });
});
