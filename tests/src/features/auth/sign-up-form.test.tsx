// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { fakeFetch, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const me = {
  id: '6f1c1a52-57a5-4a55-9f58-3f8c3d1f4a10',
  email: 'ines@example.test',
  name: 'Ines',
  teams: [{ id: '0b8f9d4e-3a53-4b0e-8c4e-1d2a3b4c5d6e', name: 'Water team', role: 'owner' }],
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
    renderWithQuery(<SignUpForm onSignedUp={vi.fn()} />);
    await fillIn({ email: 'not-an-address', password: 'short' });

    expect(await screen.findByText('Enter your name')).toBeInTheDocument();
    expect(screen.getByText('Enter a valid e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Use at least 10 characters')).toBeInTheDocument();
    expect(screen.getByText('Name your team')).toBeInTheDocument();
    expect(screen.getByLabelText('Your name')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription(
      'Use at least 10 characters',
    );
    expect(fn).not.toHaveBeenCalled();
  });

  it('when the server says the e-mail is taken, shows that on the e-mail field', async () => {
    const onSignedUp = vi.fn();
    const { requests } = fakeFetch({
      status: 409,
      body: {
        error: {
          code: 'email_taken',
          message: 'An account with this e-mail already exists.',
          fields: [{ path: 'email', message: 'An account with this e-mail already exists' }],
        },
      },
    });
    renderWithQuery(<SignUpForm onSignedUp={onSignedUp} />);
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
    expect(onSignedUp).not.toHaveBeenCalled();
  });

  it('when the server refuses without naming a field, shows its message above the button', async () => {
    fakeFetch({
      status: 429,
      body: { error: { code: 'rate_limited', message: 'Too many attempts. Try again later.' } },
    });
    renderWithQuery(<SignUpForm onSignedUp={vi.fn()} />);
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

  it('on success, hands the new user to the page and prefills given values', async () => {
    const onSignedUp = vi.fn();
    fakeFetch({ status: 201, body: me });
    renderWithQuery(
      <SignUpForm onSignedUp={onSignedUp} defaultValues={{ email: 'ines@example.test' }} />,
    );
    expect(screen.getByLabelText('E-mail')).toHaveValue('ines@example.test');
    await fillIn({ name: 'Ines', password: 'a long enough passphrase', team: 'Water team' });
    await waitFor(() => expect(onSignedUp).toHaveBeenCalledWith(me));
  });
});
