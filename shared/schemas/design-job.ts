/**
 * The Tasks section's API shapes: a design-generation job with its progress, and the design
 * currently attached to a study. Diagnostics are typed by the engine's DesignDiagnostics
 * (server/engine/design/diagnostics); here they stay opaque so shared/ imports no server code.
 */
import { z } from 'zod';
import { studyParamsSchema } from './study-params';
import type { Design } from './design';
import type { DesignSpec } from './design-spec';
import type { CriterionComparison } from './redesign';

export const designJobParamsSchema = studyParamsSchema.extend({
  jobId: z.uuid('Unknown job'),
});

export type DesignJobStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

export type DesignJobProgress = {
  phase?: 'building' | 'searching' | 'blocking' | 'diagnosing' | 'done';
  fraction?: number;
  start?: number;
  starts?: number;
  pass?: number;
  bestDError?: number;
  /** Last heartbeat of the worker (ISO time). */
  at?: string;
};

export type DesignJobView = {
  id: string;
  status: DesignJobStatus;
  spec: DesignSpec;
  /** 'candidate': generated beside the current design, to compare and adopt (or discard). */
  purpose: 'attach' | 'candidate';
  progress: DesignJobProgress;
  designId: string | null;
  error: string | null;
  cancelRequested: boolean;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
};

export type DesignView<Diagnostics = unknown> = {
  id: string;
  method: 'full_factorial' | 'random' | 'd_efficient' | 'imported';
  spec: Partial<DesignSpec> & { method: string };
  design: Design;
  diagnostics: Diagnostics;
  createdAt: string;
};

export type DesignState<Diagnostics = unknown> = {
  design: DesignView<Diagnostics> | null;
  /** A generated design waiting beside the current one, with the side-by-side comparison. */
  candidate: (DesignView<Diagnostics> & { comparison: CriterionComparison[] }) | null;
  job: DesignJobView | null;
};
