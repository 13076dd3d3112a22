/**
 * What an invitation e-mail says and who it comes from: placeholders filled, the public title
 * rather than the internal name, the duration the consent page states, plain text and HTML
 * parts, and the study's sender name and reply-to. Unknown placeholders are refused by name.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { uniqueEmail } from '../../support/factories';
import { rawSource, waitForMailTo } from '../../support/mailbox';
import { getInviteeRow, insertStudy } from './fieldwork-fixtures';
import { studies } from '../../../db/schema/studies';

const t = useTestApp({}, { signIn: 'team' });

const studyUrl = (studyId: string) => `/api/teams/${t.team.teamId}/studies/${studyId}`;

/** A live study with one invitee, whose consent page says how long the survey takes. */
async function studyWithInvitee(consentBody: string) {
  const { studyId } = await insertStudy(t.deps.db, {
    teamId: t.team.teamId,
    name: 'WS-2027 internal code name',
  });
  await t.deps.db
    .update(studies)
    .set({
      publicTitle: 'Your water services',
      questionnaire: { pages: [{ id: 'c', kind: 'consent', title: 'Welcome', body: consentBody }] },
    })
    .where(eq(studies.id, studyId));
  const email = uniqueEmail('wording');
  await t.team.agents.editor
    .post(`${studyUrl(studyId)}/invitees/import`)
    .attach('file', Buffer.from(`email,name\n${email},Ana Ferreira\n`), {
      filename: 'list.csv',
      contentType: 'text/csv',
    })
    .expect(201);
  return { studyId, email };
}

describe('invitation wording', () => {
  it('fills the placeholders, names the public title and stated duration, in text and HTML, from the study sender', async () => {
    const { studyId, email } = await studyWithInvitee(
      'Thank you for taking part. It takes 12 to 15 minutes.',
    );
    await t.team.agents.editor
      .patch(`${studyUrl(studyId)}/lifecycle/settings`)
      .send({ mailSenderName: 'Larkspur research team', mailReplyTo: 'Research@Larkspur.example' })
      .expect(200);
    await t.team.agents.editor
      .post(`${studyUrl(studyId)}/invitees/send`)
      .send({
        subject: '{study}: five questions for {name}',
        message: 'Hello from us.\n\nIt takes {duration}; <b>thank you</b>.',
      })
      .expect(200);
    const mail = (await waitForMailTo(email)) as unknown as {
      subject: string;
      text: string;
      html: string;
      from: { name: string; address: string }[];
      replyTo?: { address: string }[];
    };
    expect(mail.subject).toBe('Your water services: five questions for Ana Ferreira');
    expect(mail.text).toContain('Dear Ana Ferreira,');
    expect(mail.text).toContain('It takes 12 to 15 minutes; <b>thank you</b>.');
    expect(mail.text).not.toContain('internal code name');
    // The HTML part escapes what the researcher typed and keeps both links.
    expect(mail.html).toContain('<p>It takes 12 to 15 minutes; &lt;b&gt;thank you&lt;/b&gt;.</p>');
    const row = (await getInviteeRow(t.deps.db, email))!;
    expect(mail.html).toContain(`/s/`);
    expect(mail.html).toContain(`inv=${row.token}`);
    expect(mail.html).toContain(`/unsubscribe/${row.token}`);
    expect(mail.from[0].name).toBe('Larkspur research team');
    const source = (await rawSource(mail)).replace(/\r?\n\s+/g, ' ');
    expect(source).toMatch(/^Reply-To: research@larkspur\.example$/m);
    expect(source).not.toMatch(/X-Choicewright-Sender-Name/i);
  });

  it('by default states the duration the consent page gives, and leaves it out when it gives none', async () => {
    // The invitation with the default wording, for a study whose consent page says `consent`.
    const defaultInvitation = async (consent: string) => {
      const { studyId, email } = await studyWithInvitee(consent);
      await t.team.agents.editor
        .post(`${studyUrl(studyId)}/invitees/send`)
        .send({})
        .expect(200);
      return waitForMailTo(email);
    };
    const withDuration = await defaultInvitation('It takes about 8 minutes.');
    expect(withDuration.subject).toBe('Invitation: Your water services');
    expect(withDuration.text).toContain('It takes about 8 minutes and works on a phone');

    const without = await defaultInvitation('Thank you for taking part.');
    expect(without.text).not.toMatch(/takes|ten minutes/);
  });

  it('refuses an unknown placeholder by name, and {duration} when the consent page states none; nobody is mailed', async () => {
    const { studyId, email } = await studyWithInvitee('Thank you for taking part.');
    const send = (body: object) =>
      t.team.agents.editor
        .post(`${studyUrl(studyId)}/invitees/send`)
        .send(body)
        .expect(400);

    const unknown = await send({ subject: 'Hi {firstname}', message: 'See {study} and {link}' });
    const byPath = Object.fromEntries(
      unknown.body.error.fields.map((f: { path: string; message: string }) => [f.path, f.message]),
    );
    expect(byPath.subject).toMatch(/no placeholder \{firstname\}/);
    expect(byPath.message).toMatch(/no placeholder \{link\}/);
    expect(byPath.message).toMatch(/\{name\}, \{study\} or \{duration\}/);

    const noDuration = await send({ message: 'It takes {duration}.' });
    expect(noDuration.body.error.fields).toEqual([expect.objectContaining({ path: 'message' })]);
    expect((await getInviteeRow(t.deps.db, email))!.invitedAt).toBeNull();
  });

  it('refuses a reply-to that is not an address and a sender name with angle brackets', async () => {
    const { studyId } = await studyWithInvitee('x');
    const res = await t.team.agents.editor
      .patch(`${studyUrl(studyId)}/lifecycle/settings`)
      .send({ mailSenderName: 'Evil <a@b.c>', mailReplyTo: 'not an address' })
      .expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'mailReplyTo',
      'mailSenderName',
    ]);
  });
});
