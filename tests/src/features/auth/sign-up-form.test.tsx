// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { fakeFetch, fieldRefusal, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const accepted = {
  message: 'Check your inbox: we sent a message to ines@example.test to confirm the address.',
};

async function fillIn(values: { name?: string; email?: string; password?: string; team?: string }) {
  const user = userEvent.setup();
  if (values.name) await user.type(screen.getByLabelText('Your name'), values.name);
  if (values.email) await user.type(screen.getByLabelText('E-mail'), values.email);
  if (values.password) await user.type(screen.getByLabelText('Password'), values.password);
  if (values.team) await user.type(screen.getByLabelText('Team name'), values.team);
  await user.click(screen.getByRole('button', { name: 'Create account' }));
}

describe('SignUpForm', () => {
  it('when fields are empty or too short, shows the zod messages on the fields and sends nothing', async () => {
    const { fn } = fakeFetch();
    renderWithQuery(<SignUpForm onSubmitted={vi.fn()} />);
    await fillIn({ email: 'not-an-address', password: 'short' });

    expect(await screen.findByText('Enter your name')).toBeInTheDocument();
    expect(screen.getByText('Not a valid e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Use at least 10 characters')).toBeInTheDocument();
    expect(screen.getByText('Name your team')).toBeInTheDocument();
    expect(screen.getByLabelText('Your name')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription(
      'Use at least 10 characters',
    );
    expect(fn).not.toHaveBeenCalled();
  });

  it('when the server names a field, shows its message on that field', async () => {
    const onSubmitted = vi.fn();
    const { requests } = fakeFetch(
      fieldRefusal(409, 'email_taken', 'An account with this e-mail already exists.', [
        { path: 'email', message: 'An account with this e-mail already exists' },
      ]),
    );
    renderWithQuery(<SignUpForm onSubmitted={onSubmitted} />);
    await fillIn({
      name: 'Ines',
      email: 'Ines@Example.test',
      password: 'a long enough passphrase',
      team: 'Water team',
    });

    const email = screen.getByLabelText('E-mail');
    await waitFor(() => expect(email).toHaveAttribute('aria-invalid', 'true'));
    expect(email).toHaveAccessibleDescription('An account with this e-mail already exists');
    expect(requests).toEqual([
      {
        url: '/api/auth/sign-up',
        method: 'POST',
        body: {
          name: 'Ines',
          email: 'ines@example.test',
          password: 'a long enough passphrase',
          teamName: 'Water team',
        },
      },
    ]);
    expect(onSubmitted).not.toHaveBeenCalled();
  });

  it('when the server refuses without naming a field, shows its message above the button', async () => {
    fakeFetch({
      status: 429,
      body: { error: { code: 'rate_limited', message: 'Too many attempts. Try again later.' } },
    });
    renderWithQuery(<SignUpForm onSubmitted={vi.fn()} />);
    await fillIn({
      name: 'Ines',
      email: 'ines@example.test',
      password: 'a long enough passphrase',
      team: 'Water team',
    });
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Too many attempts. Try again later.',
    );
  });

  it('on success, hands the "check your inbox" answer to the page, with the return path', async () => {
    const onSubmitted = vi.fn();
    const { requests } = fakeFetch({ status: 202, body: accepted });
    renderWithQuery(
      <SignUpForm
        onSubmitted={onSubmitted}
        redirectTo="/invitations/abc"
        defaultValues={{ email: 'ines@example.test' }}
      />,
    );
    expect(screen.getByLabelText('E-mail')).toHaveValue('ines@example.test');
    await fillIn({ name: 'Ines', password: 'a long enough passphrase', team: 'Water team' });
    await waitFor(() =>
      expect(onSubmitted).toHaveBeenCalledWith({ ...accepted, email: 'ines@example.test' }),
    );
    expect(requests[0]?.body).toMatchObject({ redirectTo: '/invitations/abc' });
  });
});
