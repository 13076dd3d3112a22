/**
 * Sends a file as a download. Downloads may hold personal data or a study's texts, so they are
 * never cached and never sniffed into another type.
 */
import type { Response } from 'express';

export type SentFile = { filename: string; contentType: string; body: string | Buffer };

export function sendFile(res: Response, file: SentFile, inline = false): void {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Cache-Control', 'no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader(
    'Content-Disposition',
    `${inline ? 'inline' : 'attachment'}; filename="${file.filename}"`,
  );
  res.send(file.body);
}
