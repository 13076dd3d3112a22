/**
 * An uploaded text file on disk, as a stream of UTF-8 text read the way decodeText reads bytes
 * (shared/text/decode-text.ts: UTF-16 after its byte-order mark, UTF-8 when the file is valid
 * UTF-8, else Windows-1252). The file is first checked in one streaming pass, so a large file is
 * never held in memory whole; a file in another encoding is then decoded as it streams.
 */
import { createReadStream } from 'node:fs';
import { open } from 'node:fs/promises';
import { pipeline, Transform, type Readable } from 'node:stream';
import { decodeWindows1252, utf16Of } from '../../shared/text/decode-text';

async function startOf(path: string): Promise<Uint8Array> {
  const file = await open(path);
  try {
    const { buffer, bytesRead } = await file.read(Buffer.alloc(2), 0, 2, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await file.close();
  }
}

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

/** A stream of the file's text as UTF-8 bytes, each chunk decoded by `decode`. */
function decodedStream(path: string, decode: (chunk: Buffer) => string, end = () => ''): Readable {
  const text = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      done(null, Buffer.from(decode(chunk), 'utf8'));
    },
    flush(done) {
      done(null, Buffer.from(end(), 'utf8'));
    },
  });
  // Errors of the file reach the reader of the text stream.
  return pipeline(createReadStream(path), text, () => {});
}

export async function openTextFile(path: string): Promise<Readable> {
  const utf16 = utf16Of(await startOf(path));
  if (utf16) {
    // A UTF-16 code unit (or a surrogate pair) may be split between chunks: the decoder keeps
    // the part it has until the next one. It drops the byte-order mark itself.
    const decoder = new TextDecoder(utf16);
    return decodedStream(
      path,
      (chunk) => decoder.decode(chunk, { stream: true }),
      () => decoder.decode(),
    );
  }
  if (await isUtf8File(path)) return createReadStream(path);
  // One Windows-1252 byte is one letter, so chunks split anywhere.
  return decodedStream(path, decodeWindows1252);
}
