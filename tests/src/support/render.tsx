/** Renders a component with a fresh query client, and answers fetch calls with canned responses. */
import type { ReactElement } from 'react';
import { render } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { vi } from 'vitest';
import { createQueryClient } from '@/lib/query-client';

export function renderWithQuery(ui: ReactElement) {
  const queryClient = createQueryClient();
  return {
    queryClient,
    ...render(<QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>),
  };
}

export type FakeAnswer = { status: number; body?: unknown };

/** Replaces fetch: each call takes the next answer; the requests are kept for assertions. */
export function fakeFetch(...answers: FakeAnswer[]) {
  const requests: { url: string; method: string; body: unknown }[] = [];
  const fn = vi.fn(async (url: string, init?: RequestInit) => {
    requests.push({
      url,
      method: init?.method ?? 'GET',
      body: init?.body ? JSON.parse(String(init.body)) : undefined,
    });
    const a = answers.shift();
    if (!a) throw new Error(`unexpected request to ${url}`);
    return new Response(a.body === undefined ? null : JSON.stringify(a.body), {
      status: a.status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fn);
  return { fn, requests };
}

/**
 * The server's refusal naming form fields, as the API sends it: the status, an error code and
 * message, and each field's path with its message.
 */
export function fieldRefusal(
  status: number,
  code: string,
  message: string,
  fields: { path: string; message: string }[],
): FakeAnswer {
  return { status, body: { error: { code, message, fields } } };
}
