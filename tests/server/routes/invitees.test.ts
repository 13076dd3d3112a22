import { beforeAll, describe, expect, it } from 'vitest';
import type supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles, randomHex, uniqueEmail } from '../../support/factories';
import { firstLink, listMailTo, rawSource, waitForMailTo } from '../../support/mailbox';
import { getInviteeRow, insertRespondent, insertStudy } from './fieldwork-fixtures';
import { invitees } from '../../../db/schema/fieldwork';
import type { Role } from '../../../shared/permissions';
import { answerFor, insertStudy as insertLiveStudy } from './respond-fixtures';

const t = useTestApp();
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
beforeAll(async () => {
  team = await createTeamWithAllRoles(t);
});

const base = (studyId: string) => `/api/teams/${team.teamId}/studies/${studyId}/invitees`;
const csv = (text: string) => Buffer.from(text, 'utf8');
const upload = (
  agent: supertest.Agent,
  url: string,
  body: Buffer,
  fields: Record<string, string> = {},
) => {
  let req = agent.post(url);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', body, { filename: 'invitees.csv', contentType: 'text/csv' });
};
const countInvitees = async (studyId: string) =>
  (await t.deps.db.select().from(invitees).where(eq(invitees.studyId, studyId))).length;

async function importList(studyId: string, emails: string[]) {
  const text = `email,name\n${emails.map((e, i) => `${e},Person ${i + 1}`).join('\n')}\n`;
  await upload(team.agents.editor, `${base(studyId)}/import`, csv(text)).expect(201);
}

/** The invitee with `email` follows the unsubscribe link of their invitation. */
async function unsubscribe(email: string) {
  const { token } = (await getInviteeRow(t.deps.db, email))!;
  await t.request().post(`/api/unsubscribe/${token}`).expect(200);
}

describe('POST /invitees/preview', () => {
  it('when the file is valid, returns counts, the column mapping and a sample, and saves nothing', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const text = 'Email, Name ,External ID,notes\nA@Example.test,Ann,P-1,x\nb@example.test,,P-2,\n';
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, csv(text)).expect(200);
    expect(res.body).toMatchObject({ totalRows: 2, validCount: 2, errorCount: 0, errors: [] });
    expect(res.body.columns.map((c: { field: string | null }) => c.field)).toEqual([
      'email',
      'name',
      'externalId',
      null,
    ]);
    expect(res.body.sample[0]).toEqual({
      row: 2,
      email: 'a@example.test',
      name: 'Ann',
      externalId: 'P-1',
    });
    expect(res.body.sample[1]).toMatchObject({ name: '', externalId: 'P-2' });
    expect(await countInvitees(studyId)).toBe(0);
  });

  it('when rows are bad, lists each problem with its row and column', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const longName = 'n'.repeat(121);
    const text = [
      'email,name,external_id',
      'ok@example.test,Ok,E1',
      'not-an-address,Bad,E2',
      ',Missing,E3',
      'OK@example.test,Twice,E4',
      `long@example.test,${longName},E5`,
      'other@example.test,Dup id,E1',
    ].join('\n');
    const res = await upload(team.agents.owner, `${base(studyId)}/preview`, csv(text)).expect(200);
    expect(res.body).toMatchObject({ totalRows: 6, validCount: 1, errorCount: 5 });
    expect(res.body.errors).toEqual([
      { row: 3, column: 'email', message: 'Not a valid e-mail address' },
      { row: 4, column: 'email', message: 'The e-mail address is missing.' },
      { row: 5, column: 'email', message: 'Same e-mail address as row 2.' },
      { row: 6, column: 'name', message: 'Use at most 120 characters' },
      { row: 7, column: 'external_id', message: 'Same external id as row 2.' },
    ]);
  });

  it('reads semicolon-separated files with a byte-order mark', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const text = '\uFEFFe-mail;name\nsemi@example.test;Søren Ødegård\n';
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, csv(text)).expect(200);
    expect(res.body.sample).toEqual([
      { row: 2, email: 'semi@example.test', name: 'Søren Ødegård', externalId: null },
    ]);
  });

  it('reads a list a Windows spreadsheet saved in Windows-1252 with its names intact', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    // latin1 and Windows-1252 agree on ø, Ø and ü (0xF8, 0xD8, 0xFC).
    const bytes = Buffer.from('email;name\nwin@example.test;Søren Ødegård-Müller\n', 'latin1');
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, bytes).expect(200);
    expect(res.body.sample).toEqual([
      { row: 2, email: 'win@example.test', name: 'Søren Ødegård-Müller', externalId: null },
    ]);
  });

  it('reads a list saved as "Unicode text" (UTF-16, tab separated), and refuses binary data', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const unicode = 'email\tname\nu16@example.test\tŁucja Żak\n';
    const bytes = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(unicode, 'utf16le')]);
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, bytes).expect(200);
    expect(res.body.sample).toEqual([
      { row: 2, email: 'u16@example.test', name: 'Łucja Żak', externalId: null },
    ]);
    const binary = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x41]);
    const refused = await upload(team.agents.editor, `${base(studyId)}/preview`, binary);
    expect(JSON.stringify(refused.body)).toContain('not a CSV text file');
  });

  it.each([
    ['without an e-mail column', 'name,id\nAnn,1\n', /No e-mail column/],
    ['with only a header row', 'email,name\n', /no invitees/],
    ['empty', '', /empty/],
    ['with an unclosed quote', 'email\n"a@example.test\n', /could not be read as CSV/],
  ])('when the file is %s, reports a file-level problem', async (_what, text, message) => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, csv(text)).expect(200);
    expect(res.body.validCount).toBe(0);
    expect(res.body.errors[0].message).toMatch(message);
  });

  it('when the file is binary, says it is not a CSV text file', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const bytes = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08]);
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, bytes).expect(200);
    expect(res.body.errors[0].message).toMatch(/not a CSV text file/);
  });

  it('when no file is attached, returns 400 with the field', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await team.agents.editor
      .post(`${base(studyId)}/preview`)
      .field('onlyValid', 'true')
      .expect(400);
    expect(res.body.error.fields).toEqual([{ path: 'file', message: 'Choose a file' }]);
  });

  it('when the multipart body is malformed, returns 400 malformed_upload (found by fuzzing)', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await team.agents.editor
      .post(`${base(studyId)}/preview`)
      .set('Content-Type', 'multipart/form-data; boundary=x')
      .send('{"name":')
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'malformed_upload', fields: [{ path: 'file' }] });
  });

  it('when the file is over 5 MB, returns 413', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const big = Buffer.alloc(5 * 1024 * 1024 + 10, 'a');
    const res = await upload(team.agents.editor, `${base(studyId)}/preview`, big).expect(413);
    expect(res.body.error.code).toBe('file_too_large');
  });
});

describe('POST /invitees/import', () => {
  const mixed = 'email,name\ngood1@example.test,G1\nbad,B\ngood2@example.test,G2\n';

  it('when the file has errors, returns 400 with the rows and saves nothing', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await upload(team.agents.editor, `${base(studyId)}/import`, csv(mixed)).expect(400);
    expect(res.body.error.code).toBe('csv_has_errors');
    expect(res.body.error.fields).toEqual([
      { path: 'rows.3.email', message: 'Not a valid e-mail address' },
    ]);
    expect(await countInvitees(studyId)).toBe(0);
  });

  it('with onlyValid, imports the valid rows, each with its own link token', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await upload(team.agents.editor, `${base(studyId)}/import`, csv(mixed), {
      onlyValid: 'true',
    }).expect(201);
    expect(res.body).toEqual({ imported: 2, skipped: 1 });
    const rows = await t.deps.db.select().from(invitees).where(eq(invitees.studyId, studyId));
    expect(rows.map((r) => r.email).sort()).toEqual(['good1@example.test', 'good2@example.test']);
    expect(new Set(rows.map((r) => r.token)).size).toBe(2);
    expect(rows.every((r) => /^[A-Za-z0-9_-]{21}$/.test(r.token) && r.invitedAt === null)).toBe(
      true,
    );
  });

  it('a second upload of the same list marks every row as already invited', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const text = 'email\nonce@example.test\n';
    await upload(team.agents.editor, `${base(studyId)}/import`, csv(text)).expect(201);
    const res = await upload(team.agents.editor, `${base(studyId)}/import`, csv(text)).expect(400);
    expect(res.body.error.fields[0].message).toMatch(/Already on this study's invitation list/);
    expect(await countInvitees(studyId)).toBe(1);
  });

  it('when onlyValid is not true/false, returns 400 and saves nothing', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const res = await upload(team.agents.editor, `${base(studyId)}/import`, csv(mixed), {
      onlyValid: 'yes',
    }).expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(await countInvitees(studyId)).toBe(0);
  });

  it('when even onlyValid finds a file-level problem, returns 400', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    await upload(team.agents.editor, `${base(studyId)}/import`, csv('name\nAnn\n'), {
      onlyValid: 'true',
    }).expect(400);
    expect(await countInvitees(studyId)).toBe(0);
  });
});

describe('invitee routes by role', () => {
  const expected: Record<Role, { import: number; list: number; send: number }> = {
    owner: { import: 201, list: 200, send: 200 },
    editor: { import: 201, list: 200, send: 200 },
    analyst: { import: 403, list: 200, send: 403 },
    viewer: { import: 403, list: 403, send: 403 },
  };
  it.each(Object.entries(expected))('%s gets the right statuses', async (role, codes) => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const agent = team.agents[role as Role];
    const text = `email\n${uniqueEmail(role)}\n`;
    await upload(agent, `${base(studyId)}/import`, csv(text)).expect(codes.import);
    await upload(agent, `${base(studyId)}/preview`, csv(text)).expect(
      codes.import === 201 ? 200 : 403,
    );
    await agent.get(base(studyId)).expect(codes.list);
    await agent
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(codes.send);
    await agent
      .post(`${base(studyId)}/remind`)
      .send({})
      .expect(codes.send);
  });

  it('a member of another team gets 404 and the list is untouched', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    await importList(studyId, [uniqueEmail('x')]);
    await upload(team.outsider, `${base(studyId)}/import`, csv('email\nz@example.test\n')).expect(
      404,
    );
    await team.outsider.get(base(studyId)).expect(404);
    await team.outsider
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(404);
    expect(await countInvitees(studyId)).toBe(1);
  });

  it("a study of another team is 404 even through one's own team id", async () => {
    const other = await createTeamWithAllRoles(t);
    const { studyId } = await insertStudy(t.deps.db, { teamId: other.teamId });
    await team.agents.owner.get(base(studyId)).expect(404);
  });

  it('without a session, returns 401', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    await t.request().get(base(studyId)).expect(401);
  });
});

describe('GET /invitees', () => {
  it('lists invitees with their state, filters by state and searches', async () => {
    const { studyId, versionId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const tag = randomHex();
    const emails = ['a', 'b', 'c', 'd'].map((x) => `${x}-${tag}@example.test`);
    await importList(studyId, emails);
    await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({ inviteeIds: [(await getInviteeRow(t.deps.db, emails[1]))!.id] })
      .expect(200);
    const c = (await getInviteeRow(t.deps.db, emails[2]))!;
    await t.deps.db.update(invitees).set({ invitedAt: new Date() }).where(eq(invitees.id, c.id));
    await insertRespondent(t.deps.db, { studyId, versionId, inviteeId: c.id });
    await unsubscribe(emails[3]);

    const res = await team.agents.analyst.get(base(studyId)).expect(200);
    expect(res.body.total).toBe(4);
    expect(res.body.items.map((i: { state: string }) => i.state)).toEqual([
      'not_sent',
      'invited',
      'completed',
      'unsubscribed',
    ]);
    const byState = await team.agents.analyst.get(`${base(studyId)}?state=invited`).expect(200);
    expect(byState.body.items.map((i: { email: string }) => i.email)).toEqual([emails[1]]);
    const search = await team.agents.analyst.get(`${base(studyId)}?search=c-${tag}`).expect(200);
    expect(search.body.total).toBe(1);
    await team.agents.analyst.get(`${base(studyId)}?state=lost&pageSize=9999`).expect(400);
  });

  it('DELETE removes one invitee; an unknown id is 404', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const email = uniqueEmail('gone');
    await importList(studyId, [email]);
    const row = (await getInviteeRow(t.deps.db, email))!;
    await team.agents.editor.delete(`${base(studyId)}/${row.id}`).expect(204);
    await team.agents.editor.delete(`${base(studyId)}/${row.id}`).expect(404);
    await team.agents.editor.delete(`${base(studyId)}/not-a-uuid`).expect(400);
  });
});

describe('POST /invitees/send', () => {
  it('mails each invitee a personal link and an unsubscribe link, once', async () => {
    const { studyId, publicId } = await insertStudy(t.deps.db, {
      teamId: team.teamId,
      name: 'Larkspur packages',
    });
    const email = uniqueEmail('inv');
    await importList(studyId, [email]);
    const res = await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(200);
    expect(res.body).toEqual({ sent: 1, queued: 0, failed: 0, skipped: 0 });
    const mail = await waitForMailTo(email);
    const row = (await getInviteeRow(t.deps.db, email))!;
    expect(mail.subject).toBe('Invitation: Larkspur packages');
    expect(firstLink(mail.text)).toBe(`http://127.0.0.1:5999/s/${publicId}?inv=${row.token}`);
    expect(mail.text).toContain(`http://127.0.0.1:5999/unsubscribe/${row.token}`);
    const source = await rawSource(mail);
    expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click$/m);
    expect(source.replace(/\r?\n /g, ' ')).toContain(
      `List-Unsubscribe: <http://127.0.0.1:5999/api/unsubscribe/${row.token}>`,
    );
    expect(row.invitedAt).not.toBeNull();

    const again = await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(200);
    expect(again.body.sent).toBe(0);
    expect(await listMailTo(email)).toHaveLength(1);
  });

  it('uses the custom subject and message when given', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const email = uniqueEmail('custom');
    await importList(studyId, [email]);
    await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({ subject: 'Your water, your say', message: 'Ten minutes of your time, please.' })
      .expect(200);
    const mail = await waitForMailTo(email);
    expect(mail.subject).toBe('Your water, your say');
    expect(mail.text).toContain('Ten minutes of your time, please.');
    expect(mail.text).toMatch(/unsubscribe\//);
  });

  it('when the study is not live, returns 409 and mails nobody', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId, status: 'draft' });
    const email = uniqueEmail('draft');
    await importList(studyId, [email]);
    const res = await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(409);
    expect(res.body.error.code).toBe('study_not_live');
    expect((await getInviteeRow(t.deps.db, email))!.invitedAt).toBeNull();
  });

  it('when the body is malformed, returns 400 and mails nobody', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const email = uniqueEmail('malformed');
    await importList(studyId, [email]);
    const res = await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({ inviteeIds: ['nope'], subject: '' })
      .expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toEqual(
      expect.arrayContaining(['inviteeIds.0', 'subject']),
    );
    expect((await getInviteeRow(t.deps.db, email))!.invitedAt).toBeNull();
  });
});

describe('unsubscribe', () => {
  it('GET shows the study and a masked address without unsubscribing; POST unsubscribes once', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId, name: 'Water study' });
    const email = uniqueEmail('unsub');
    await importList(studyId, [email]);
    const { token } = (await getInviteeRow(t.deps.db, email))!;
    const status = await t.request().get(`/api/unsubscribe/${token}`).expect(200);
    expect(status.body).toEqual({
      studyName: 'Water study',
      maskedEmail: `u***@example.test`,
      unsubscribed: false,
    });
    await t.request().post(`/api/unsubscribe/${token}`).expect(200);
    const first = (await getInviteeRow(t.deps.db, email))!.unsubscribedAt;
    expect(first).not.toBeNull();
    const again = await t.request().post(`/api/unsubscribe/${token}`).expect(200);
    expect(again.body.unsubscribed).toBe(true);
    expect((await getInviteeRow(t.deps.db, email))!.unsubscribedAt).toEqual(first);
  });

  it('an unknown token is 404 and a malformed one 400', async () => {
    await t.request().get('/api/unsubscribe/abcdefghijklmnopqrstu').expect(404);
    await t.request().post('/api/unsubscribe/abc%20def%3Cx%3E').expect(400);
  });

  it('is honoured by later invitations and reminders', async () => {
    const { studyId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const early = uniqueEmail('early');
    const late = uniqueEmail('late');
    await importList(studyId, [early, late]);
    await unsubscribe(early);
    const sent = await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(200);
    expect(sent.body.sent).toBe(1);
    await waitForMailTo(late);
    await unsubscribe(late);
    const reminded = await team.agents.editor
      .post(`${base(studyId)}/remind`)
      .send({})
      .expect(200);
    expect(reminded.body.sent).toBe(0);
    expect(await listMailTo(early)).toHaveLength(0);
    expect(await listMailTo(late)).toHaveLength(1);
  });
});

describe('POST /invitees/remind', () => {
  it('reminds only invitees who were invited and have not finished, at most once an hour', async () => {
    const { studyId, versionId } = await insertStudy(t.deps.db, { teamId: team.teamId });
    const [pending, started, done, screened, notSent] = [
      'pending',
      'started',
      'done',
      'screened',
      'notsent',
    ].map((p) => uniqueEmail(p));
    await importList(studyId, [pending, started, done, screened]);
    await team.agents.editor
      .post(`${base(studyId)}/send`)
      .send({})
      .expect(200);
    await importList(studyId, [notSent]);
    const idOf = async (e: string) => (await getInviteeRow(t.deps.db, e))!.id;
    await insertRespondent(t.deps.db, {
      studyId,
      versionId,
      status: 'in_progress',
      inviteeId: await idOf(started),
    });
    await insertRespondent(t.deps.db, { studyId, versionId, inviteeId: await idOf(done) });
    await insertRespondent(t.deps.db, {
      studyId,
      versionId,
      status: 'screened_out',
      inviteeId: await idOf(screened),
    });

    const res = await team.agents.editor
      .post(`${base(studyId)}/remind`)
      .send({})
      .expect(200);
    expect(res.body).toEqual({ sent: 2, queued: 0, failed: 0, skipped: 0 });
    await waitForMailTo(pending);
    const reminders = async (e: string) =>
      (await listMailTo(e)).filter((m) => m.subject.startsWith('Reminder'));
    expect(await reminders(pending)).toHaveLength(1);
    expect(await reminders(started)).toHaveLength(1);
    expect(await reminders(done)).toHaveLength(0);
    expect(await reminders(screened)).toHaveLength(0);
    expect(await listMailTo(notSent)).toHaveLength(0);
    const row = (await getInviteeRow(t.deps.db, pending))!;
    expect(row.reminderCount).toBe(1);

    const again = await team.agents.editor
      .post(`${base(studyId)}/remind`)
      .send({ inviteeIds: [row.id] })
      .expect(200);
    expect(again.body).toEqual({ sent: 0, queued: 0, failed: 0, skipped: 1 });
    expect(await reminders(pending)).toHaveLength(1);
  });
});

describe('the personal link end to end', () => {
  it('an invitee who completes through the link is shown as completed and gets no reminder', async () => {
    const study = await insertLiveStudy(t, team.teamId);
    await team.agents.editor
      .post(`/api/teams/${team.teamId}/studies/${study.id}/lifecycle/go-live`)
      .send({})
      .expect(200);
    const [done, pending] = [uniqueEmail('journey'), uniqueEmail('waiting')];
    await importList(study.id, [done, pending]);
    await team.agents.editor
      .post(`${base(study.id)}/send`)
      .send({})
      .expect(200);

    const link = new URL(firstLink((await waitForMailTo(done)).text));
    expect(link.pathname).toBe(`/s/${study.publicId}`);
    const respondent = t.request();
    const session = await respondent
      .post(`/api/r/${study.publicId}/sessions`)
      .send({ params: { inv: link.searchParams.get('inv') }, device: 'test phone' })
      .expect(201);
    for (const screen of session.body.screens)
      await respondent
        .post(`/api/r/${study.publicId}/answers`)
        .set('x-respondent-token', session.body.sessionToken)
        .send(answerFor(screen))
        .expect(201);

    const list = await team.agents.editor.get(base(study.id)).expect(200);
    const state = (e: string) =>
      list.body.items.find((i: { email: string }) => i.email === e).state;
    expect(state(done)).toBe('completed');
    expect(state(pending)).toBe('invited');
    const reminded = await team.agents.editor
      .post(`${base(study.id)}/remind`)
      .send({})
      .expect(200);
    expect(reminded.body.sent).toBe(1);
    await waitForMailTo(pending);
    expect((await listMailTo(done)).filter((m) => m.subject.startsWith('Reminder'))).toHaveLength(
      0,
    );
    const stats = await team.agents.viewer
      .get(`/api/teams/${team.teamId}/studies/${study.id}/fieldwork`)
      .expect(200);
    expect(stats.body.invitations).toMatchObject({
      sent: 2,
      reminded: 1,
      started: 1,
      completed: 1,
    });
    expect(stats.body.counts.completed).toBe(1);
  });
});
