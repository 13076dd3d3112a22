// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fieldworkSettingsSchema } from '@shared/schemas/study-lifecycle';

const patch = vi.fn();
vi.mock('@/lib/api-client', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/lib/api-client')>();
  return { ...real, api: { ...real.api, patch: (...args: unknown[]) => patch(...args) } };
});
const { SettingsForm } = await import('@/features/lifecycle/components/settings-form');

afterEach(() => {
  cleanup();
  patch.mockReset();
});

function renderForm() {
  const settings = fieldworkSettingsSchema.parse({});
  render(
    <QueryClientProvider client={new QueryClient()}>
      <SettingsForm teamId="t1" studyId="s1" settings={settings} canManage />
    </QueryClientProvider>,
  );
}

describe('SettingsForm: panel ids and late answers', () => {
  it('shows the defaults and sends the de-duplication switch and grace period', async () => {
    patch.mockResolvedValue({});
    renderForm();
    const dedupe = screen.getByRole('checkbox', { name: /One respondent per panel id/ });
    expect(dedupe).toBeChecked();
    const grace = screen.getByLabelText('Accept answers given before the close for (hours)');
    expect(grace).toHaveValue('24');
    await userEvent.click(dedupe);
    await userEvent.clear(grace);
    await userEvent.type(grace, '48');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(patch).toHaveBeenCalledTimes(1));
    expect(patch.mock.calls[0][1]).toMatchObject({
      dedupePanelIds: false,
      lateAnswerGraceHours: 48,
    });
  });

  it('refuses a grace period over 30 days without sending anything', async () => {
    renderForm();
    const grace = screen.getByLabelText('Accept answers given before the close for (hours)');
    await userEvent.clear(grace);
    await userEvent.type(grace, '900');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText('At most 720 hours (30 days)')).toBeInTheDocument();
    expect(patch).not.toHaveBeenCalled();
  });

  it('sends each redirect under its outcome, and an empty one as none', async () => {
    patch.mockResolvedValue({});
    renderForm();
    const complete = screen.getByLabelText('Redirect when complete');
    expect(complete).toHaveAttribute('placeholder', 'https://panel.example/complete?id={pid}');
    expect(screen.getByLabelText('Redirect when over quota')).toHaveAccessibleDescription(
      "{pid} is replaced by the respondent's panel id.",
    );
    await userEvent.type(
      screen.getByLabelText('Redirect when screened out'),
      'https://p.example/s',
    );
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(patch).toHaveBeenCalledTimes(1));
    expect(patch.mock.calls[0][1]).toMatchObject({
      redirects: { complete: null, screenedOut: 'https://p.example/s', overQuota: null },
    });
  });
});

describe('SettingsForm: invitation e-mails', () => {
  it('sends the reply-to address as typed with spaces and capitals, trimmed and lower-cased', async () => {
    patch.mockResolvedValue({});
    renderForm();
    await userEvent.type(
      screen.getByLabelText('Replies to invitations go to'),
      ' Ana@Example.org ',
    );
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(patch).toHaveBeenCalledTimes(1));
    expect(patch.mock.calls[0][1]).toMatchObject({ mailReplyTo: 'ana@example.org' });
  });

  it('refuses a sender name the server would refuse, with the server’s message, sending nothing', async () => {
    renderForm();
    await userEvent.type(screen.getByLabelText('Invitation e-mails come from'), 'Larkspur <Water>');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText('No angle brackets, quotes or line breaks')).toBeInTheDocument();
    expect(patch).not.toHaveBeenCalled();
  });
});
