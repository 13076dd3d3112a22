import { Alert } from '@/components/ui/feedback';
import { tasteCautions } from '@shared/schemas/exports';
import { LOW_EFFECTIVE_DRAWS } from '@shared/schemas/tastes';

/** The cautions shown wherever taste profiles appear (common practice for individual-level estimates; see docs/methods.md). */
export function TasteCautions({ lowDraws }: { lowDraws?: number }) {
  return (
    <Alert tone="warning" title="Read individual profiles with care">
      <ul className="list-disc space-y-1 pl-5">
        {tasteCautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
        <li>
          A profile is flagged <strong>few draws</strong> when its effective number of draws is
          below {LOW_EFFECTIVE_DRAWS} (a rule of thumb for a stable mean; common practice, no
          source).
          {lowDraws !== undefined && lowDraws > 0 && (
            <>
              {' '}
              {lowDraws} {lowDraws === 1 ? 'respondent is' : 'respondents are'} flagged in this
              view.
            </>
          )}
        </li>
      </ul>
    </Alert>
  );
}
