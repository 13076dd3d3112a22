/** Reads mail from the fake SMTP server's HTTP API (maildev), as a person would read their inbox. */
export type ReceivedMail = { subject: string; text: string; to: { address: string }[] };

function apiBase(): string {
  return `http://127.0.0.1:${process.env.CW_TEST_MAIL_WEB_PORT ?? '1080'}`;
}

export async function listMailTo(address: string): Promise<ReceivedMail[]> {
  const res = await fetch(`${apiBase()}/api/email`);
  if (!res.ok) throw new Error(`mail server answered ${res.status}`);
  const all = (await res.json()) as ReceivedMail[];
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
}

/** Waits for the newest mail to an address (delivery is asynchronous). */
export async function waitForMailTo(address: string, timeoutMs = 5000): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mails = await listMailTo(address);
    if (mails.length > 0) return mails[mails.length - 1];
    if (Date.now() > deadline) throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error('no link in mail');
  return m[0];
}

/** Waits for the newest mail to an address whose subject matches. */
export async function waitForMailWithSubject(
  address: string,
  subject: RegExp,
  timeoutMs = 15_000,
): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mails = (await listMailTo(address)).filter((m) => subject.test(m.subject));
    if (mails.length > 0) return mails[mails.length - 1];
    if (Date.now() > deadline)
      throw new Error(`no mail "${subject}" to ${address} in ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
