/**
 * The one HTTP client. Non-2xx answers become a typed ApiError carrying the server's
 * `{ error: { code, message, fields } }`; a 401 is reported once to the session handler.
 */
export type FieldIssue = { path: string; message: string };

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldIssue[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let onUnauthenticated: (() => void) | null = null;
export function setUnauthenticatedHandler(fn: () => void): void {
  onUnauthenticated = fn;
}

type Options = {
  method?: string;
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
  /** 'file': a download; resolves to the body as a Blob with the server's file name. */
  as?: 'json' | 'file';
};

export type DownloadedFile = { blob: Blob; filename: string };

const fileNameOf = (res: Response) =>
  /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '')?.[1] ?? 'download';

export async function apiRequest<T>(path: string, opts: Options = {}): Promise<T> {
  const isForm = typeof FormData !== 'undefined' && opts.body instanceof FormData;
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method: opts.method ?? 'GET',
      credentials: 'same-origin',
      signal: opts.signal,
      headers: {
        Accept: 'application/json',
        ...(opts.body !== undefined && !isForm ? { 'Content-Type': 'application/json' } : {}),
        ...opts.headers,
      },
      body:
        opts.body === undefined
          ? undefined
          : isForm
            ? (opts.body as FormData)
            : JSON.stringify(opts.body),
    });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(
      0,
      'network',
      'Cannot reach the server. Check your connection and try again.',
    );
  }
  if (res.status === 204) return undefined as T;
  if (res.ok && opts.as === 'file')
    return { blob: await res.blob(), filename: fileNameOf(res) } as T;
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error;
    const err = new ApiError(
      res.status,
      e?.code ?? 'http_error',
      e?.message ?? `Request failed (${res.status}).`,
      e?.fields ?? [],
    );
    if (res.status === 401 && !path.startsWith('/auth/')) onUnauthenticated?.();
    throw err;
  }
  return data as T;
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => apiRequest<T>(path, { signal }),
  post: <T>(path: string, body?: unknown) =>
    apiRequest<T>(path, { method: 'POST', body: body ?? {} }),
  put: <T>(path: string, body?: unknown) =>
    apiRequest<T>(path, { method: 'PUT', body: body ?? {} }),
  patch: <T>(path: string, body?: unknown) =>
    apiRequest<T>(path, { method: 'PATCH', body: body ?? {} }),
  delete: <T>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
  upload: <T>(path: string, form: FormData) => apiRequest<T>(path, { method: 'POST', body: form }),
  /** POST that answers with a file (a download built from the request body). */
  postForFile: (path: string, body: unknown) =>
    apiRequest<DownloadedFile>(path, { method: 'POST', body, as: 'file' }),
};

/** Copies server field issues into a react-hook-form form. */
export function applyFieldErrors(
  err: unknown,
  setError: (name: never, e: { type: string; message: string }) => void,
): boolean {
  if (!(err instanceof ApiError) || err.fields.length === 0) return false;
  for (const f of err.fields) setError(f.path as never, { type: 'server', message: f.message });
  return true;
}
