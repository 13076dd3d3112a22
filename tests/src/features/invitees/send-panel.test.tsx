// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, screen } from '@testing-library/react';
import { describeSend, SendPanel } from '@/features/invitees/components/send-panel';
import { renderWithQuery } from '../../support/render';

afterEach(cleanup);

describe('SendPanel', () => {
  it('sends nothing and claims nothing while the list is empty', () => {
    renderWithQuery(<SendPanel teamId="t" studyId="s" live listSize={0} />);
    expect(screen.getByText(/Nobody is on the list yet/)).toBeVisible();
    expect(screen.getByRole('button', { name: 'Send invitations' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Send reminders' })).toBeDisabled();
    expect(document.body.textContent).not.toMatch(/invited already/);
  });

  it('lets a live study with people on the list send', () => {
    renderWithQuery(<SendPanel teamId="t" studyId="s" live listSize={12} />);
    expect(screen.getByRole('button', { name: 'Send invitations' })).toBeEnabled();
    expect(screen.queryByText(/Nobody is on the list yet/)).toBeNull();
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
