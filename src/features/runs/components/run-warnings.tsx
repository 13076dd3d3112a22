/** The warnings a finished run carries (Hessian, starts, extreme tasks, WTP withheld, …). */
import type { RunResult } from '@shared/schemas/run';
import { Alert } from '@/components/ui/feedback';

export function RunWarnings({ results }: { results: RunResult }) {
  const warnings = results.warnings ?? [];
  if (warnings.length === 0 && results.converged) return null;
  return (
    <Alert tone="warning" title={`Warnings (${warnings.length + (results.converged ? 0 : 1)})`}>
      <ul className="list-disc space-y-1 pl-5">
        {!results.converged && (
          <li>
            The estimation did not converge ({results.convergence.reason});{' '}
            {results.model === 'hb'
              ? 'see the sampler diagnostics.'
              : results.model === 'latent_class'
                ? 'EM stopped at its iteration limit.'
                : 'see the gradient under Convergence.'}
          </li>
        )}
        {warnings.map((w, i) => (
          <li key={`${w.code}-${i}`}>
            {w.message}
            {w.tasks && w.tasks.length > 0 && (
              <span className="block text-xs text-ink-muted">Tasks: {w.tasks.join('; ')}</span>
            )}
          </li>
        ))}
      </ul>
    </Alert>
  );
}
