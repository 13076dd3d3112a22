/**
 * An uploaded text file on disk, as a stream of UTF-8 text read the way decodeText reads bytes
 * (shared/text/decode-text.ts: UTF-8 when the file is valid UTF-8, else Windows-1252). The file
 * is first checked in one streaming pass, so a large file is never held in memory whole; a
 * Windows-1252 file is then decoded as it streams (one byte is one letter, so chunks split
 * anywhere).
 */
import { createReadStream } from 'node:fs';
import { pipeline, Transform, type Readable } from 'node:stream';
import { decodeWindows1252 } from '../../shared/text/decode-text';

async function isUtf8File(path: string): Promise<boolean> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  try {
    for await (const chunk of createReadStream(path)) decoder.decode(chunk, { stream: true });
    decoder.decode();
    return true;
  } catch (error) {
    // The decoder's refusal; a file that cannot be read is another error.
    if ((error as { code?: string }).code === 'ERR_ENCODING_INVALID_ENCODED_DATA') return false;
    throw error;
  }
}

export async function openTextFile(path: string): Promise<Readable> {
  if (await isUtf8File(path)) return createReadStream(path);
  const text = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      done(null, Buffer.from(decodeWindows1252(chunk), 'utf8'));
    },
  });
  // Errors of the file reach the reader of the text stream.
  return pipeline(createReadStream(path), text, () => {});
}
