/**
 * A tiny JSON client for scripts that drive the API as a signed-in user (demo runs,
 * benchmarks): keeps the session cookie the sign-in sets and turns error bodies into
 * readable exceptions.
 */
export function createJsonClient(baseUrl: string) {
  const base = baseUrl.replace(/\/+$/, '');
  let cookie = '';
  async function request<T>(method: string, url: string, body?: unknown): Promise<T> {
    const res = await fetch(`${base}/api${url}`, {
      method,
      headers: {
        Accept: 'application/json',
        // The server refuses state-changing requests that carry a session without an Origin.
        Origin: base,
        // A FormData body (a file upload) sets its own multipart content type.
        ...(body === undefined || body instanceof FormData
          ? {}
          : { 'Content-Type': 'application/json' }),
        ...(cookie ? { Cookie: cookie } : {}),
      },
      body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body),
      signal: AbortSignal.timeout(30_000),
    });
    const setCookies = res.headers.getSetCookie();
    if (setCookies.length > 0) cookie = setCookies.map((c) => c.split(';')[0]).join('; ');
    const text = await res.text();
    if (!res.ok) {
      let message = text.slice(0, 300);
      try {
        message = (JSON.parse(text) as { error?: { message?: string } }).error?.message ?? message;
      } catch {
        // not JSON: keep the raw text
      }
      throw new Error(`${method} ${url} answered ${res.status}: ${message}`);
    }
    return (text ? JSON.parse(text) : undefined) as T;
  }
  /** The session cookie, for requests the client cannot make (large streamed uploads). */
  return Object.assign(request, { cookie: () => cookie });
}
