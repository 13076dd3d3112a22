// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describeSend, SendPanel } from '@/features/invitees/components/send-panel';
import { api } from '@/lib/api-client';
import { renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.restoreAllMocks();
});

const props = {
  teamId: 't',
  studyId: 's',
  live: true,
  listSize: 12,
  notInvited: 5,
  notFinished: 3,
  studyTitle: 'Your water services',
  duration: 'about 10 minutes',
};

describe('SendPanel', () => {
  it('sends nothing and claims nothing while the list is empty', () => {
    renderWithQuery(<SendPanel {...props} listSize={0} notInvited={0} notFinished={0} />);
    expect(screen.getByText(/Nobody is on the list yet/)).toBeVisible();
    expect(screen.getByRole('button', { name: 'Send invitations' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Send reminders' })).toBeDisabled();
    expect(document.body.textContent).not.toMatch(/invited already/);
  });

  it('lets a live study with people on the list send', () => {
    renderWithQuery(<SendPanel {...props} />);
    expect(screen.getByRole('button', { name: 'Send invitations' })).toBeEnabled();
    expect(screen.queryByText(/Nobody is on the list yet/)).toBeNull();
  });
});

describe('SendPanel wording and confirmation', () => {
  it('previews the wording with its placeholders filled, and refuses an unknown one by name', async () => {
    const user = userEvent.setup();
    renderWithQuery(<SendPanel {...props} />);
    await user.click(screen.getByText('Change the wording'));
    await user.type(screen.getByLabelText('Subject'), '{{study} for {{name}');
    const preview = screen.getByRole('region', { name: 'Preview of the invitation' });
    expect(preview).toHaveTextContent('Your water services for Ana Ferreira');
    expect(preview).toHaveTextContent('It takes about 10 minutes');
    await user.type(screen.getByLabelText(/^Message/), 'Hi {{first}');
    await user.click(screen.getByRole('button', { name: 'Send invitations' }));
    expect(await screen.findByText(/no placeholder \{first\}/)).toBeVisible();
    expect(screen.queryByRole('dialog')).toBeNull();
  });

  it('asks first, naming how many people a send reaches; cancel sends nothing', async () => {
    const user = userEvent.setup();
    renderWithQuery(<SendPanel {...props} />);
    await user.click(screen.getByRole('button', { name: 'Send invitations' }));
    const dialog = await screen.findByRole('dialog', { name: 'Send invitations to 5 people?' });
    expect(dialog).toBeVisible();
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Send reminders' }));
    expect(
      await screen.findByRole('dialog', { name: 'Send reminders to up to 3 people?' }),
    ).toBeVisible();
  });

  it('cannot send invitations when everyone on the list has been invited', () => {
    renderWithQuery(<SendPanel {...props} notInvited={0} />);
    expect(screen.getByRole('button', { name: 'Send invitations' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Send reminders' })).toBeEnabled();
  });
});

describe('SendPanel sends', () => {
  it('posts invitations to send and reminders to remind, each with the wording typed', async () => {
    const post = vi
      .spyOn(api, 'post')
      .mockResolvedValue({ sent: 1, queued: 0, failed: 0, skipped: 0 });
    const user = userEvent.setup();
    renderWithQuery(<SendPanel {...props} />);
    await user.click(screen.getByText('Change the wording'));
    await user.type(screen.getByLabelText('Subject'), 'About {{study}');
    await user.click(screen.getByRole('button', { name: 'Send invitations' }));
    await user.click(await screen.findByRole('button', { name: 'Send 5 invitations' }));
    await user.click(screen.getByRole('button', { name: 'Send reminders' }));
    const dialog = await screen.findByRole('dialog', { name: /Send reminders/ });
    await user.click(within(dialog).getByRole('button', { name: 'Send reminders' }));
    expect(post.mock.calls.map(([path, body]) => [path, body])).toEqual([
      ['/teams/t/studies/s/invitees/send', { subject: 'About {study}' }],
      ['/teams/t/studies/s/invitees/remind', { subject: 'About {study}' }],
    ]);
  });
});

describe('describeSend', () => {
  it('reports what a send did', () => {
    expect(describeSend('invitations', { sent: 3, queued: 1, failed: 0, skipped: 0 })).toBe(
      '3 invitations sent; 1 waiting for the mail server, which could not take them yet; they are retried automatically.',
    );
    expect(describeSend('reminders', { sent: 0, queued: 0, failed: 2, skipped: 0 })).toBe(
      '0 reminders sent; 2 refused by the mail server (the list shows why).',
    );
    expect(describeSend('invitations', { sent: 0, queued: 0, failed: 0, skipped: 0 })).toBe(
      '0 invitations sent; everybody on the list had been invited already.',
    );
  });
});
