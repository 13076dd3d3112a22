// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { PasswordForm } from '@/features/account/components/password-form';
import { fakeFetch, fieldRefusal, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

async function submit(current: string, next: string, repeat: string) {
  const user = userEvent.setup();
  if (current) await user.type(screen.getByLabelText('Current password'), current);
  if (next) await user.type(screen.getByLabelText('New password'), next);
  if (repeat) await user.type(screen.getByLabelText('Repeat the new password'), repeat);
  await user.click(screen.getByRole('button', { name: 'Change password' }));
}

describe('PasswordForm', () => {
  it('when the repeat differs or the current password is missing, says so and sends nothing', async () => {
    const { fn } = fakeFetch();
    renderWithQuery(<PasswordForm onChanged={vi.fn()} />);
    await submit('', 'a long enough passphrase', 'a different passphrase');
    expect(await screen.findByText('The two passwords differ')).toBeInTheDocument();
    expect(screen.getByText('Enter your current password')).toBeInTheDocument();
    expect(fn).not.toHaveBeenCalled();
  });

  it('when the server says the current password is wrong, marks that field', async () => {
    const onChanged = vi.fn();
    const { requests } = fakeFetch(
      fieldRefusal(400, 'invalid_input', 'Your current password is wrong.', [
        { path: 'currentPassword', message: 'Current password is wrong' },
      ]),
    );
    renderWithQuery(<PasswordForm onChanged={onChanged} />);
    await submit('guessed wrong', 'a long enough passphrase', 'a long enough passphrase');
    const current = screen.getByLabelText('Current password');
    await waitFor(() => expect(current).toHaveAccessibleDescription('Current password is wrong'));
    // Only the two passwords travel; the repeat stays in the browser.
    expect(requests[0].body).toEqual({
      currentPassword: 'guessed wrong',
      newPassword: 'a long enough passphrase',
    });
    expect(onChanged).not.toHaveBeenCalled();
  });
});
