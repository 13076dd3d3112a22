/**
 * The scenario's welfare beside its shares: the compensating variation against the status
 * quo, in the cost attribute's money, with its interval and how it was computed.
 */
import type { ShareResult } from '@shared/schemas/shares';
import { formatAmount, formatCount, formatInterval } from '@/utils/format';

export function WelfarePanel({ result }: { result: ShareResult }) {
  const w = result.welfare;
  if (!w)
    return result.welfareNote ? (
      <p className="text-sm text-ink-soft">No welfare figure: {result.welfareNote}</p>
    ) : null;
  const money = (x: number | null | undefined) => formatAmount(x, w.unit);
  return (
    <div className="space-y-2 text-sm">
      <p className="text-ink">
        Offering these alternatives beside “{w.baseline}” is worth{' '}
        <strong className="num">{money(w.mean)}</strong> per respondent
        {result.method !== 'point_estimates' ? ' on average' : ''}, in units of{' '}
        {w.money.toLowerCase()}
        {w.interval && (
          <>
            {' '}
            (95 % interval <span className="num">{formatInterval(w.lower, w.upper, money)}</span>)
          </>
        )}
        .
      </p>
      {w.population && (
        <p className="text-ink">
          Over the model's whole population of tastes it is worth{' '}
          <strong className="num">{money(w.population.mean)}</strong> per person
          {w.population.lower !== null && (
            <>
              {' '}
              (95 % interval from the estimates' covariance{' '}
              <span className="num">
                {formatInterval(w.population.lower, w.population.upper, money)}
              </span>
              )
            </>
          )}
          .
        </p>
      )}
      {w.populationNote && (
        <p className="text-xs text-ink-muted">Population figure: {w.populationNote}</p>
      )}
      <p className="text-xs text-ink-muted">
        Compensating variation by the log-sum formula (Small &amp; Rosen 1981; Train 2009 §3.5)
        against a choice with only “{w.baseline}” available.{' '}
        {result.method !== 'point_estimates'
          ? `Each respondent's value from their taste profile (latent class: their classes' values weighted by their class probabilities), averaged over ${formatCount(w.respondents)} respondents${w.withheld > 0 ? ` (${formatCount(w.withheld)} without a negative cost coefficient left out)` : ''}. This interval comes from resampling respondents: it shows how much the average depends on who answered, not the estimation error of the model's parameters.`
          : 'The interval comes from Krinsky–Robb draws of the estimates from their covariance.'}{' '}
        {w.population &&
          'The population figure averages the same formula over the estimated taste distribution; its interval comes from Krinsky–Robb draws of the estimates, so it carries their estimation error. '}
        A negative value means the scenario leaves people worse off than the status quo. Stated,
        hypothetical choices tend to overstate what people would pay.
      </p>
    </div>
  );
}
