/**
 * Reads mail from the fake SMTP server's HTTP API (maildev), as a person would read their inbox.
 * The vitest runs read the server the test set-up started; the browser journeys read theirs
 * through the same inbox (e2e/support/mail.ts).
 */
export type ReceivedMail = { subject: string; text: string; to: { address: string }[] };

/** The inbox behind a maildev API (`…/api/email`), polled every `pollMs` while mail is awaited. */
export function maildevInbox(apiUrl: () => string, pollMs: number) {
  async function listMailTo(address: string): Promise<ReceivedMail[]> {
    const res = await fetch(apiUrl());
    if (!res.ok) throw new Error(`mail server answered ${res.status}`);
    const all = (await res.json()) as ReceivedMail[];
    return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
  }

  /** The newest mail to an address (whose subject matches, when given); delivery is asynchronous. */
  async function waitForMail(
    address: string,
    timeoutMs: number,
    subject?: RegExp,
  ): Promise<ReceivedMail> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const mails = (await listMailTo(address)).filter((m) => !subject || subject.test(m.subject));
      if (mails.length > 0) return mails[mails.length - 1];
      if (Date.now() > deadline)
        throw new Error(
          subject
            ? `no mail "${subject}" to ${address} in ${timeoutMs} ms`
            : `no mail to ${address} within ${timeoutMs} ms`,
        );
      await new Promise((r) => setTimeout(r, pollMs));
    }
  }

  /** The raw message as delivered (the API's summary drops some headers). */
  async function rawSource(mail: object): Promise<string> {
    const id = (mail as { id: string }).id;
    return (await fetch(`${apiUrl()}/${id}/source`)).text();
  }

  return { listMailTo, waitForMail, rawSource };
}

const inbox = maildevInbox(
  () => `http://127.0.0.1:${process.env.CW_TEST_MAIL_WEB_PORT ?? '1080'}/api/email`,
  100,
);

export const { listMailTo, rawSource } = inbox;

/** Waits for the newest mail to an address. */
export const waitForMailTo = (address: string, timeoutMs = 5000) =>
  inbox.waitForMail(address, timeoutMs);

/** Waits for the newest mail to an address whose subject matches. */
export const waitForMailWithSubject = (address: string, subject: RegExp, timeoutMs = 15_000) =>
  inbox.waitForMail(address, timeoutMs, subject);

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error('no link in mail');
  return m[0];
}
