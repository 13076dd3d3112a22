/**
 * Messages between the design worker and its caller. Progress goes over a MessagePort
 * passed in the task (transferred); the result is a plain object (design + diagnostics).
 */
import type { MessagePort } from 'node:worker_threads';
import type { DesignProgress, GeneratedDesign } from './generate-design';
import type { DesignErrorCode } from './design-errors';
import type { CriterionComparison } from '../../../shared/schemas/redesign';

export interface DesignWorkerTask {
  definition: unknown;
  spec: unknown;
  /** The study's current design: the result then compares it with the new one. */
  compareWith?: unknown;
  /** Optional port that receives `{ type: 'progress', progress }` messages. */
  port?: MessagePort;
}

export type DesignWorkerResult =
  | { ok: true; result: GeneratedDesign; comparison?: CriterionComparison[] }
  | {
      ok: false;
      error: { code: DesignErrorCode; message: string; fields?: Record<string, string> };
    };

export interface DesignProgressMessage {
  type: 'progress';
  progress: DesignProgress;
}
