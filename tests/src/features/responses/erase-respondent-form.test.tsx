// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';

const post = vi.fn();
vi.mock('@/lib/api-client', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/lib/api-client')>();
  return { ...real, api: { ...real.api, post: (...args: unknown[]) => post(...args) } };
});
const { EraseRespondentForm } =
  await import('@/features/responses/components/erase-respondent-form');
const { ApiError } = await import('@/lib/api-client');

afterEach(() => {
  cleanup();
  post.mockReset();
});

const preview = {
  number: 7,
  reference: '3f2a9c1d',
  status: 'completed',
  answers: 12,
  revisions: 1,
  invitation: true,
  runsAffected: 2,
};

function renderForm() {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <EraseRespondentForm teamId="t1" studyId="s1" />
    </QueryClientProvider>,
  );
}

async function findSeven() {
  await userEvent.type(screen.getByLabelText('Respondent number'), '7');
  await userEvent.click(screen.getByRole('button', { name: 'Find' }));
  await screen.findByRole('region', { name: 'What will be erased' });
}

describe('EraseRespondentForm', () => {
  it('previews, asks in its own dialog, and erases only after confirming', async () => {
    post.mockResolvedValueOnce(preview);
    renderForm();
    await findSeven();
    expect(post).toHaveBeenLastCalledWith('/teams/t1/studies/s1/erasure/preview', {
      by: 'number',
      value: '7',
    });
    await userEvent.type(
      screen.getByLabelText('Reason (kept in the audit trail)'),
      'Request DP-2026-014',
    );
    await userEvent.click(screen.getByRole('button', { name: 'Erase respondent 7…' }));
    const dialog = await screen.findByRole('dialog', { name: 'Erase respondent 7?' });
    expect(dialog).toHaveTextContent('12 answers, 1 earlier answer and the personal invitation');
    expect(dialog).toHaveTextContent('2 model runs will say');
    // Cancel has the focus first: a stray Enter never erases.
    expect(within(dialog).getByRole('button', { name: 'Cancel' })).toHaveFocus();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(post).toHaveBeenCalledTimes(1);

    post.mockResolvedValueOnce({ ...preview, erasedAt: '2026-12-03T03:00:00.000Z' });
    await userEvent.click(screen.getByRole('button', { name: 'Erase respondent 7…' }));
    const again = await screen.findByRole('dialog', { name: 'Erase respondent 7?' });
    await userEvent.click(within(again).getByRole('button', { name: 'Erase for good' }));
    await waitFor(() => expect(post).toHaveBeenCalledTimes(2));
    expect(post).toHaveBeenLastCalledWith('/teams/t1/studies/s1/erasure', {
      by: 'number',
      value: '7',
      reason: 'Request DP-2026-014',
    });
    expect(await screen.findByText('Erased respondent 7.')).toBeInTheDocument();
  });

  it('refuses a number that is not one before asking the server', async () => {
    renderForm();
    await userEvent.type(screen.getByLabelText('Respondent number'), 'seven');
    await userEvent.click(screen.getByRole('button', { name: 'Find' }));
    expect(await screen.findByText('Enter a whole number from 1')).toBeInTheDocument();
    expect(post).not.toHaveBeenCalled();
  });

  it('needs a reason before the dialog opens', async () => {
    post.mockResolvedValueOnce(preview);
    renderForm();
    await findSeven();
    await userEvent.click(screen.getByRole('button', { name: 'Erase respondent 7…' }));
    expect(await screen.findByText(/Give the reason for the erasure/)).toBeInTheDocument();
    expect(screen.queryByRole('dialog')).not.toBeInTheDocument();
  });

  it("shows the server's field error on the lookup, and a new lookup forgets the preview", async () => {
    post.mockRejectedValueOnce(
      new ApiError(404, 'respondent_not_found', 'This study has no respondent number 70.', [
        { path: 'value', message: 'This study has no respondent number 70.' },
      ]),
    );
    renderForm();
    await userEvent.type(screen.getByLabelText('Respondent number'), '70');
    await userEvent.click(screen.getByRole('button', { name: 'Find' }));
    expect(await screen.findByText('This study has no respondent number 70.')).toBeInTheDocument();

    post.mockResolvedValueOnce(preview);
    await userEvent.clear(screen.getByLabelText('Respondent number'));
    await findSeven();
    await userEvent.type(screen.getByLabelText('Respondent number'), '1');
    expect(screen.queryByRole('region', { name: 'What will be erased' })).not.toBeInTheDocument();
  });
});
