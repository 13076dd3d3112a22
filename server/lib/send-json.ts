/**
 * A JSON reply without Express's res.json: no ETag (a SHA-1 of every body, useless on replies
 * that are never cached or revalidated, such as a respondent's answer receipt: POST, no-store)
 * and no content-type lookup. The body and headers are what res.json sends, less the ETag.
 */
import type { Response } from 'express';

export function sendJson(res: Response, status: number, value: unknown): void {
  sendJsonText(res, status, JSON.stringify(value));
}

/** The same, for a body already written as JSON (a session start's reply: survey-view.ts). */
export function sendJsonText(res: Response, status: number, body: string): void {
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('Content-Length', Buffer.byteLength(body));
  res.end(body);
}
