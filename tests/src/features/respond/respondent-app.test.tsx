// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { RespondentSession } from '@shared/schemas/respondent';
import { RespondentApp } from '@/features/respond/components/respondent-app';
import { readOutbox } from '@/features/respond/utils/respondent-storage';
import { englishInterfaceTexts } from '@shared/languages/interface-texts';
import { requiredSingleQuestion } from '@shared/schemas/required-single-question';

const session: RespondentSession = {
  sessionToken: 'T'.repeat(32),
  studyName: 'Water services',
  language: 'en',
  dir: 'ltr',
  languages: [{ tag: 'en', name: 'English', dir: 'ltr' }],
  ui: englishInterfaceTexts,
  status: 'in_progress',
  definition: {
    attributes: [
      {
        id: 'bill',
        name: 'Monthly bill increase',
        kind: 'numeric',
        isCost: true,
        coding: 'linear',
        unit: '€',
        levels: [
          { id: 'b0', label: '€0', value: 0 },
          { id: 'b6', label: '€6', value: 6 },
        ],
      },
    ],
    alternatives: { count: 2, labeled: false, labels: [] },
    fixedAlternative: null,
  },
  screens: [
    {
      key: 'consent',
      kind: 'consent',
      title: 'Welcome',
      body: 'You may stop at any time.',
      agreeLabel: 'I agree',
    },
    {
      key: 'task:1',
      kind: 'task',
      taskKind: 'design',
      title: 'Which would you choose?',
      taskIndex: 1,
      taskCount: 1,
      alternatives: [
        { index: 1, label: 'Option A', levels: { bill: 'b6' }, fixed: false },
        { index: 0, label: 'Option B', levels: { bill: 'b0' }, fixed: false },
      ],
    },
    {
      key: 'q:household_size',
      kind: 'question',
      screening: false,
      question: {
        type: 'number',
        key: 'household_size',
        text: 'How many people live with you?',
        help: '',
        required: true,
        min: 1,
        max: 12,
        integer: true,
        unit: '',
      },
    },
  ],
  answered: [],
  end: { title: 'Thank you', body: 'Your answers have been saved.' },
  redirectUrl: null,
  surveyOpen: true,
  back: { allowBack: true, backOnTasks: true },
  given: {},
};

type Call = { url: string; body: unknown };
let calls: Call[];
/** The session the fake server starts: `session` unless a test asks for another. */
let served: RespondentSession;
let failNextAnswer: number;

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json' },
  });
}

beforeEach(() => {
  localStorage.clear();
  calls = [];
  failNextAnswer = 0;
  served = session;
  vi.stubGlobal('fetch', async (url: string, init?: RequestInit) => {
    const body = init?.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ url, body });
    if (url === '/api/r/abc123' || url.startsWith('/api/r/abc123?'))
      return json(200, { state: 'live', studyName: 'Water services', redirectUrl: null });
    if (url.endsWith('/sessions')) return json(201, served);
    if (url.endsWith('/answers')) {
      if (failNextAnswer > 0) {
        failNextAnswer--;
        throw new TypeError('Failed to fetch');
      }
      const last = body.screenKey === 'q:household_size';
      return json(201, {
        screenKey: body.screenKey,
        nextScreenKey: null,
        status: last ? 'completed' : 'in_progress',
        redirectUrl: null,
        replay: false,
      });
    }
    return json(404, { error: { code: 'not_found', message: 'no' } });
  });
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('RespondentApp', () => {
  it('keeps an answer in the outbox while offline and sends it once the connection returns', async () => {
    const user = userEvent.setup();
    render(<RespondentApp publicId="abc123" search="" />);
    await user.click(await screen.findByLabelText('I agree'));
    await user.click(screen.getByRole('button', { name: 'Start' }));

    failNextAnswer = 1;
    await user.click(await screen.findByRole('radio', { name: 'Option B' }));
    await user.click(screen.getByRole('button', { name: 'Next' }));
    // The next screen shows at once; the failed answer waits in localStorage.
    expect(
      await screen.findByRole('heading', { name: 'How many people live with you?' }),
    ).toHaveFocus();
    await waitFor(() =>
      expect(readOutbox('abc123').map((i) => i.answer.screenKey)).toEqual(['task:1']),
    );
    expect(screen.getByText(/You seem to be offline/)).toBeInTheDocument();

    await waitFor(() => expect(readOutbox('abc123')).toEqual([]), { timeout: 4000 });
    const sent = calls
      .filter((c) => c.url.endsWith('/answers'))
      .map((c) => c.body as { clientId: string; screenKey: string; value: unknown });
    const taskTries = sent.filter((b) => b.screenKey === 'task:1');
    expect(taskTries).toHaveLength(2);
    expect(taskTries[0].clientId).toBe(taskTries[1].clientId);
    expect(taskTries[0].value).toEqual({ kind: 'choice', position: 1 });
  });

  it('lines the study title up with the screen below it: the narrow column, the wide one on a task', async () => {
    const user = userEvent.setup();
    render(<RespondentApp publicId="abc123" search="" />);
    const widthOf = (el: Element) => [...el.classList].find((c) => c.startsWith('max-w-'));
    const frame = () => screen.getByRole('heading', { level: 1 }).closest('section')!;
    await user.click(await screen.findByLabelText('I agree'));
    const title = screen.getByText('Water services');
    expect(widthOf(title)).toBe(widthOf(frame()));
    expect(widthOf(title)).toBe('max-w-2xl');
    await user.click(screen.getByRole('button', { name: 'Start' }));
    await screen.findByRole('radio', { name: 'Option B' });
    expect(widthOf(screen.getByText('Water services'))).toBe(widthOf(frame()));
    expect(widthOf(frame())).toBe('max-w-5xl');
  });

  it('asks how sure the respondent is under the task, and sends the answer with the choice', async () => {
    const scale = {
      question: 'How sure are you?',
      points: 5,
      lowLabel: 'Unsure',
      highLabel: 'Sure',
    };
    served = {
      ...session,
      screens: session.screens.map((sc) => (sc.kind === 'task' ? { ...sc, certainty: scale } : sc)),
    };
    const user = userEvent.setup();
    render(<RespondentApp publicId="abc123" search="" />);
    await user.click(await screen.findByLabelText('I agree'));
    await user.click(screen.getByRole('button', { name: 'Start' }));

    await user.click(await screen.findByRole('radio', { name: 'Option B' }));
    const group = screen.getByRole('group', { name: 'How sure are you?' });
    expect(group).toHaveAccessibleDescription('1 means Unsure, 5 means Sure.');
    // A choice alone is not enough while the certainty question is open.
    expect(screen.getByRole('button', { name: 'Next' })).toBeDisabled();
    await user.click(within(group).getByRole('radio', { name: '4' }));
    await user.click(screen.getByRole('button', { name: 'Next' }));
    await screen.findByRole('heading', { name: 'How many people live with you?' });
    await waitFor(() =>
      expect(
        calls.find(
          (c) =>
            c.url.endsWith('/answers') && (c.body as { screenKey: string }).screenKey === 'task:1',
        )?.body,
      ).toMatchObject({ value: { kind: 'choice', position: 1, certainty: 4 } }),
    );
  });

  it('goes past a page whose skip rule does not match, sending it as skipped', async () => {
    const gardenQuestion = requiredSingleQuestion('garden', 'Does your home have a garden?', [
      { id: 'yes', label: 'Yes' },
      { id: 'no', label: 'No' },
    ]);
    served = {
      ...session,
      screens: [
        session.screens[0],
        {
          key: 'q:garden',
          kind: 'question',
          screening: false,
          question: gardenQuestion,
          decidesSkips: true,
        },
        {
          key: 'page:watering',
          kind: 'instructions',
          title: 'About your garden',
          body: 'The next questions are about watering.',
          showIf: { questionKey: 'garden', optionIds: ['yes'], min: null, max: null },
        },
        session.screens[2],
      ],
    };
    const user = userEvent.setup();
    render(<RespondentApp publicId="abc123" search="" />);
    await user.click(await screen.findByLabelText('I agree'));
    await user.click(screen.getByRole('button', { name: 'Start' }));
    await user.click(await screen.findByRole('radio', { name: 'No' }));
    await user.click(screen.getByRole('button', { name: 'Next' }));
    // Straight on to the next page that applies; the garden page never shows.
    await screen.findByRole('heading', { name: 'How many people live with you?' });
    expect(screen.queryByText('About your garden')).toBeNull();
    await waitFor(() =>
      expect(
        calls
          .filter((c) => c.url.endsWith('/answers'))
          .map((c) => [
            (c.body as { screenKey: string }).screenKey,
            (c.body as { value: unknown }).value,
          ]),
      ).toEqual([
        ['consent', { kind: 'consent', agreed: true }],
        ['q:garden', { kind: 'single', optionId: 'no' }],
        ['page:watering', { kind: 'skipped' }],
      ]),
    );
    // The answer the rule read stands: no Back to it.
    expect(screen.queryByRole('button', { name: 'Back' })).toBeNull();
  });

  it('checks a number answer against its range before saving, then ends on the saved page', async () => {
    const user = userEvent.setup();
    localStorage.setItem('cw:respond:abc123:token', session.sessionToken);
    render(<RespondentApp publicId="abc123" search="?pid=P1" />);
    await user.click(await screen.findByLabelText('I agree'));
    await user.click(screen.getByRole('button', { name: 'Start' }));
    await user.click(await screen.findByRole('radio', { name: 'Option A' }));
    await user.click(screen.getByRole('button', { name: 'Next' }));
    const input = await screen.findByLabelText('How many people live with you?');
    await user.type(input, '40');
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(screen.getByRole('alert')).toHaveTextContent('Enter a number from 1 to 12.');
    await user.clear(input);
    await user.type(input, '3');
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(await screen.findByText('Your answers have been saved.')).toBeInTheDocument();
    const start = calls.find((c) => c.url.endsWith('/sessions'))!.body as {
      sessionToken: string;
      params: Record<string, string>;
    };
    expect(start.sessionToken).toBe(session.sessionToken);
    expect(start.params).toEqual({ pid: 'P1' });
  });
});

describe('RespondentApp before a session', () => {
  it('shows a closed survey’s page in the link’s language, with the page’s language and direction', async () => {
    vi.stubGlobal('fetch', async (url: string) => {
      if (url.endsWith('/sessions'))
        return json(410, { error: { code: 'survey_closed', message: 'closed' } });
      return json(200, {
        state: 'closed',
        studyName: 'خدمات المياه',
        redirectUrl: null,
        page: { language: 'ar', dir: 'rtl', title: 'انتهى الاستطلاع', body: 'شكرا لاهتمامك.' },
      });
    });
    render(<RespondentApp publicId="abc123" search="?lang=ar" />);
    expect(await screen.findByRole('heading', { name: 'انتهى الاستطلاع' })).toBeVisible();
    expect(screen.getByText('شكرا لاهتمامك.')).toBeVisible();
    // The page sets <html lang dir> in an effect after it renders: wait for it on a busy machine.
    await waitFor(() => expect(document.documentElement).toHaveAttribute('lang', 'ar'));
    expect(document.documentElement).toHaveAttribute('dir', 'rtl');
  });
});
