/**
 * Warnings a run carries with its results: problems that do not stop the estimation but that
 * the analyst must see (a Hessian that is not negative definite, an extreme task, WTP withheld,
 * simulation noise, …). Each names the parameters or tasks involved.
 */
export interface EstimationWarning {
  code:
    | 'hessian_not_negative_definite'
    | 'gradient_check'
    | 'extreme_tasks'
    | 'not_converged'
    | 'starts_disagree'
    | 'wtp_withheld'
    | 'simulation_noise'
    | 'membership_separated'
    | 'no_standard_errors';
  message: string;
  parameters?: string[];
  tasks?: string[];
}

/** "respondent 12, task 3" labels for task indexes of the data (at most `limit`). */
export function describeTasks(
  data: { respondentIds: readonly string[]; taskIds: readonly string[]; taskStart: Int32Array },
  tasks: readonly number[],
  limit = 10,
): string[] {
  const out: string[] = [];
  let n = 0;
  for (const t of tasks.slice(0, limit)) {
    while (data.taskStart[n + 1] <= t) n++;
    out.push(`respondent ${data.respondentIds[n] ?? n + 1}, task ${data.taskIds[t] ?? t + 1}`);
  }
  return out;
}
