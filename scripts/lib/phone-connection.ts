/**
 * One simulated phone's keep-alive HTTP/1.1 connection to one server, for the load client
 * (respondent-load.ts): one request at a time, as a phone's browser sends them, on a
 * connection opened at the phone's first request and kept between requests; opened again
 * when the server has closed it. It writes each request in one write and reads the reply
 * itself (status line, headers, a body by Content-Length or chunked), because node:http's
 * client with an agent per phone cost the load process about as much CPU per request as the
 * server spent answering it (profile of bench:fieldwork): a ClientRequest, agent bookkeeping
 * and several events and ticks per request, none of which a phone's browser puts on the
 * server. What goes over the wire is the same: the same requests, headers and connections.
 */
import net from 'node:net';
import zlib from 'node:zlib';

export type PhoneReply = {
  status: number;
  retryAfter: string | undefined;
  json: Record<string, unknown>;
};

const HEADER_END = Buffer.from('\r\n\r\n');

function decoded(body: Buffer, encoding: string | undefined): Buffer {
  if (encoding === 'br') return zlib.brotliDecompressSync(body);
  if (encoding === 'gzip') return zlib.gunzipSync(body);
  if (encoding === 'deflate') return zlib.inflateSync(body);
  return body;
}

type Head = { status: number; headers: Map<string, string>; bodyAt: number };

function parseHead(buf: Buffer, end: number): Head {
  const lines = buf.toString('latin1', 0, end).split('\r\n');
  const status = Number(lines[0].slice(9, 12));
  if (!lines[0].startsWith('HTTP/1.') || !(status >= 100 && status < 600))
    throw new Error(`not an HTTP reply: ${lines[0].slice(0, 40)}`);
  const headers = new Map<string, string>();
  for (let i = 1; i < lines.length; i++) {
    const colon = lines[i].indexOf(':');
    if (colon > 0)
      headers.set(lines[i].slice(0, colon).trim().toLowerCase(), lines[i].slice(colon + 1).trim());
  }
  return { status, headers, bodyAt: end + HEADER_END.length };
}

/**
 * The body of a chunked reply once it is all there (chunk sizes in hex, each chunk followed
 * by CRLF, a zero-size chunk and the (empty) trailer last; RFC 9112, section 7.1), else null.
 */
export function dechunk(buf: Buffer, from: number): Buffer | null {
  const parts: Buffer[] = [];
  let at = from;
  for (;;) {
    const lineEnd = buf.indexOf('\r\n', at, 'latin1');
    if (lineEnd < 0) return null;
    const size = parseInt(buf.toString('latin1', at, lineEnd).split(';')[0], 16);
    if (!Number.isFinite(size)) throw new Error('malformed chunk size');
    at = lineEnd + 2;
    // The last chunk: the (empty) trailer section ends with an empty line.
    if (size === 0)
      return buf.indexOf('\r\n\r\n', lineEnd, 'latin1') >= 0 ? Buffer.concat(parts) : null;
    if (buf.length < at + size + 2) return null;
    parts.push(buf.subarray(at, at + size));
    at += size + 2;
  }
}

type Pending = {
  resolve: (r: PhoneReply) => void;
  reject: (e: Error) => void;
  timer: NodeJS.Timeout;
  received: Buffer | null;
  head: Head | null;
};

export class PhoneConnection {
  private socket: net.Socket | null = null;
  private pending: Pending | null = null;
  private readonly host: string;
  private readonly port: number;
  private readonly hostHeader: string;

  /** base: http://host:port of the server. */
  constructor(
    base: string,
    private readonly timeoutMs: number,
  ) {
    const url = new URL(base);
    this.host = url.hostname;
    this.port = Number(url.port || 80);
    this.hostHeader = url.host;
  }

  /**
   * POSTs a JSON body (already serialised) with the given header lines (each ending in CRLF)
   * and resolves with the reply's JSON. Rejects on a network error, a reply not complete within
   * the timeout (the connection is then dropped, as a browser would give up on it) or a 2xx
   * whose body is not JSON: the caller sends the request again.
   */
  post(path: string, headerLines: string, body: string): Promise<PhoneReply> {
    if (this.pending) return Promise.reject(new Error('one request at a time per phone'));
    const socket = this.socket ?? this.connect();
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => socket.destroy(new Error('timed out')), this.timeoutMs);
      this.pending = { resolve, reject, timer, received: null, head: null };
      socket.write(
        `POST ${path} HTTP/1.1\r\nHost: ${this.hostHeader}\r\nConnection: keep-alive\r\n` +
          `${headerLines}Content-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}`,
      );
    });
  }

  close(): void {
    this.socket?.destroy();
    this.socket = null;
  }

  private connect(): net.Socket {
    const socket = net.connect({ host: this.host, port: this.port, noDelay: true });
    this.socket = socket;
    // Events of a connection already given up (timed out, replaced) concern nobody.
    socket.on('data', (chunk: Buffer) => {
      if (this.socket === socket) this.onData(chunk);
    });
    socket.on('error', (err) => {
      if (this.socket === socket) this.fail(err);
    });
    socket.on('close', () => {
      if (this.socket === socket) this.fail(new Error('connection closed'));
    });
    return socket;
  }

  private fail(err: Error): void {
    this.close();
    const p = this.pending;
    if (!p) return;
    this.pending = null;
    clearTimeout(p.timer);
    p.reject(err);
  }

  private onData(chunk: Buffer): void {
    const p = this.pending;
    if (!p) return; // Nothing asked: a stray byte after a reply; the next reply will fail loudly.
    const buf = p.received ? Buffer.concat([p.received, chunk]) : chunk;
    p.received = buf;
    try {
      if (!p.head) {
        const end = buf.indexOf(HEADER_END);
        if (end < 0) return;
        p.head = parseHead(buf, end);
      }
      const { status, headers, bodyAt } = p.head;
      let body: Buffer | null;
      const length = headers.get('content-length');
      if (headers.get('transfer-encoding')?.includes('chunked')) body = dechunk(buf, bodyAt);
      else if (length !== undefined)
        body =
          buf.length >= bodyAt + Number(length)
            ? buf.subarray(bodyAt, bodyAt + Number(length))
            : null;
      else throw new Error('a reply without a length (not sent by this server)');
      if (!body) return;
      this.pending = null;
      clearTimeout(p.timer);
      if (headers.get('connection')?.toLowerCase() === 'close') this.close();
      let json: Record<string, unknown> = {};
      try {
        json = JSON.parse(
          decoded(body, headers.get('content-encoding')).toString('utf8'),
        ) as Record<string, unknown>;
      } catch (err) {
        if (status >= 200 && status < 300) return p.reject(err as Error);
      }
      p.resolve({ status, retryAfter: headers.get('retry-after'), json });
    } catch (err) {
      this.fail(err as Error);
    }
  }
}
