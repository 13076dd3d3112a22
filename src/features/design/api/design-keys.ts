/** Query keys of the design feature (the Tasks section). */
export const designKeys = {
  all: ['designs'] as const,
  state: (teamId: string, studyId: string) => [...designKeys.all, teamId, studyId] as const,
  runPriors: (teamId: string, studyId: string, runId: string, spread: string) =>
    [...designKeys.state(teamId, studyId), 'run-priors', runId, spread] as const,
  job: (teamId: string, studyId: string, jobId: string) =>
    [...designKeys.state(teamId, studyId), 'job', jobId] as const,
};
