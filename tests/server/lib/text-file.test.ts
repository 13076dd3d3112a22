/**
 * Uploaded files on disk as UTF-8 text (server/lib/text-file.ts), read as decodeText reads
 * bytes; the Windows-1252 byte values are those of the WHATWG Encoding Standard's index.
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openTextFile } from '../../../server/lib/text-file';

let dir = '';
beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'cw-text-file-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

async function textOf(bytes: Buffer): Promise<string> {
  const file = path.join(dir, `f-${Math.random().toString(36).slice(2)}.csv`);
  await writeFile(file, bytes);
  const chunks: Buffer[] = [];
  for await (const chunk of await openTextFile(file)) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks).toString('utf8');
}

describe('openTextFile', () => {
  // Long enough to take several of the file stream's 64 KiB chunks, the accents past the first.
  const long = 'respondent;task;alt;chosen;river\n' + 'H001;1;1;0;ok\n'.repeat(20_000);
  const text = long + 'H002;1;1;1;Gewässer grün, Café\n';
  // The same with the euro sign and curly quotes, which Windows-1252 writes as 0x80, 0x93, 0x94.
  const windows = Buffer.concat([
    Buffer.from(text, 'latin1'),
    Buffer.from([0x80, 0x20, 0x93, 0x6f, 0x6b, 0x94, 0x0a]),
  ]);

  it('streams a UTF-8 file unchanged', async () => {
    expect(await textOf(Buffer.from(text, 'utf8'))).toBe(text);
  });

  it('streams a Windows-1252 file as UTF-8 text with its accented letters', async () => {
    // latin1 and Windows-1252 agree on ä, ü and é.
    expect(await textOf(windows)).toBe(`${text}€ “ok”\n`);
  });

  it('streams a UTF-16 file with its byte-order mark as UTF-8 text, a surrogate pair included', async () => {
    const unicode = `${text}Łucja 💧\n`;
    const bytes = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(unicode, 'utf16le')]);
    expect(await textOf(bytes)).toBe(unicode);
  });

  it('refuses a file that is not there with the file system’s error', async () => {
    await expect(openTextFile(path.join(dir, 'missing.csv'))).rejects.toMatchObject({
      code: 'ENOENT',
    });
  });
});
