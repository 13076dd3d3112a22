/**
 * The respondent routes' JSON body parser: express.json() (body-parser) with a short way for
 * the body every phone sends — `Content-Type: application/json` (utf-8), no Content-Encoding,
 * a Content-Length within the limit. For that body body-parser parses the media type, builds
 * a raw-body reader with an iconv decoder and several listeners, and tracks the request with
 * on-finished: about 4 % of an answer's CPU in the web process (bench:fieldwork profile). The
 * short way reads the bytes itself and parses them exactly as body-parser's strict JSON mode
 * does (a byte-order mark dropped as iconv-lite drops it; an empty body is `{}`; only an
 * object or an array at the top), failing with the same status and `type` the error handler
 * reads. Every other request (another type or charset, compressed, chunked, empty, too large,
 * a stream already read) goes to express.json() itself, so 413, 415 and the rest are its own.
 */
import express, { type Request, type RequestHandler } from 'express';

/** Content-Type values taken the short way (lower-cased). */
const PLAIN_TYPES = new Set([
  'application/json',
  'application/json; charset=utf-8',
  'application/json;charset=utf-8',
]);

const DIGITS = /^\d{1,9}$/;

/** body-parser's strict mode: the first character that is not JSON whitespace (RFC 8259 §2). */
const FIRST_NON_WHITESPACE = /^[ \t\n\r]*([^ \t\n\r]|$)/;

/** The shape of body-parser's errors (http-errors) that error-handler.ts reads. */
export class BodyError extends Error {
  readonly expose = true;
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
  ) {
    super(message);
  }
}

/** The body's length when it can take the short way, else null. */
function plainJsonLength(req: Request, limit: number): number | null {
  const h = req.headers;
  if (h['transfer-encoding'] !== undefined || h['content-encoding'] !== undefined) return null;
  const type = h['content-type'];
  if (type === undefined || !PLAIN_TYPES.has(type.toLowerCase())) return null;
  const declared = h['content-length'];
  if (declared === undefined || !DIGITS.test(declared)) return null;
  const length = Number(declared);
  if (length === 0 || length > limit) return null;
  // Already read, or a connection closing: body-parser's own checks (on-finished) decide.
  if (req.complete && !req.readable) return null;
  if (!req.socket?.readable) return null;
  return length;
}

/** As body-parser's strict JSON parser (body-parser 2, lib/types/json.js). */
export function parseStrictJson(text: string): unknown {
  if (text.length === 0) return {};
  if (text[0] !== '{' && text[0] !== '[') {
    const first = FIRST_NON_WHITESPACE.exec(text)?.[1];
    if (first !== '{' && first !== '[')
      throw new BodyError(400, 'entity.parse.failed', 'JSON body must be an object or array');
  }
  try {
    return JSON.parse(text);
  } catch (err) {
    throw new BodyError(400, 'entity.parse.failed', (err as Error).message);
  }
}

function readPlainJson(req: Request, length: number, next: (err?: unknown) => void): void {
  const chunks: Buffer[] = [];
  let received = 0;
  const stop = () => {
    req.off('data', onData);
    req.off('end', onEnd);
    req.off('error', onError);
  };
  const onData = (chunk: Buffer) => {
    chunks.push(chunk);
    received += chunk.length;
  };
  const onError = () => {
    stop();
    next(new BodyError(400, 'request.aborted', 'request aborted'));
  };
  const onEnd = () => {
    stop();
    if (received !== length)
      return next(
        new BodyError(400, 'request.size.invalid', 'request size did not match content length'),
      );
    const bytes = chunks.length === 1 ? chunks[0] : Buffer.concat(chunks, received);
    let text = bytes.toString('utf8');
    // iconv-lite, body-parser's decoder, drops a leading byte-order mark.
    if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    let body: unknown;
    try {
      body = parseStrictJson(text);
    } catch (err) {
      return next(err);
    }
    req.body = body;
    next();
  };
  req.on('data', onData);
  req.on('end', onEnd);
  req.on('error', onError);
}

export function createRespondentJson(limitBytes: number): RequestHandler {
  const full = express.json({ limit: limitBytes });
  return (req, res, next) => {
    const length = plainJsonLength(req, limitBytes);
    if (length === null) return full(req, res, next);
    // As body-parser: a request it reads has a body property, even when reading fails.
    if (!('body' in req)) Reflect.set(req, 'body', undefined);
    readPlainJson(req, length, next);
  };
}
