import { ScreenCaution } from '@/components/ui/screen-caution';
import { tasteCautions } from '@shared/schemas/exports';
import { LOW_EFFECTIVE_DRAWS } from '@shared/schemas/tastes';

/** The one caution of a screen where taste profiles appear (docs/methods.md, "Reading results: cautions"). */
export function TasteCautions({
  screen,
  lowDraws,
}: {
  screen: 'tastes' | 'respondent';
  lowDraws?: number;
}) {
  return (
    <ScreenCaution
      screen={screen}
      summary={
        <>
          Profiles are conditional on each respondent&apos;s choices: shrunk toward the population
          and uncertain with few tasks.
          {lowDraws !== undefined && lowDraws > 0 && (
            <>
              {' '}
              {lowDraws} {lowDraws === 1 ? 'respondent is' : 'respondents are'} flagged{' '}
              <strong>few draws</strong> in this view.
            </>
          )}
        </>
      }
    >
      <ul className="list-disc space-y-1 pl-5">
        {tasteCautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
        <li>
          A profile is flagged <strong>few draws</strong> when its effective number of draws is
          below {LOW_EFFECTIVE_DRAWS} (product default, for a stable mean; raise the profile draws
          of the run when many respondents fall below it).
        </li>
      </ul>
    </ScreenCaution>
  );
}
