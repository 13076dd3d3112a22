/** Stored design and design-job rows as the API shows them. */
import type { getDesignById } from '../../db/queries/designs';
import type { getDesignJob } from '../../db/queries/design-jobs';
import type { Design } from '../../shared/schemas/design';
import type { DesignJobView, DesignView } from '../../shared/schemas/design-job';

type JobRow = NonNullable<Awaited<ReturnType<typeof getDesignJob>>>;
type DesignRow = NonNullable<Awaited<ReturnType<typeof getDesignById>>>;

export function toJobView(row: JobRow): DesignJobView {
  return {
    id: row.id,
    status: row.status,
    spec: row.spec as DesignJobView['spec'],
    purpose: row.purpose === 'candidate' ? 'candidate' : 'attach',
    progress: row.progress as DesignJobView['progress'],
    designId: row.designId,
    error: row.error,
    cancelRequested: row.cancelRequested !== null,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

export function toDesignView(row: DesignRow): DesignView {
  return {
    id: row.id,
    method: row.method as DesignView['method'],
    spec: row.spec as DesignView['spec'],
    design: row.design as Design,
    diagnostics: row.diagnostics as DesignView['diagnostics'],
    createdAt: row.createdAt.toISOString(),
  };
}
