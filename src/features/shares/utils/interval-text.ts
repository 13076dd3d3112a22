/** What the share intervals on screen are, in words (the UI always says which kind is shown). */
import type { ShareIntervalKind } from '@shared/schemas/shares';
import { formatCount } from '@/utils/format';

export function describeInterval(
  kind: ShareIntervalKind | null,
  draws: number,
  note: string | null,
): string {
  if (kind === 'parameter')
    return `95 % intervals from ${formatCount(draws)} Krinsky–Robb draws of the estimates from their covariance: how much the shares could move given the estimation error.`;
  if (kind === 'conditional')
    return `95 % intervals from ${formatCount(draws)} draws of each respondent’s tastes conditional on their choices (normal with their conditional mean and SD, lognormal for lognormal coefficients; latent class: their class probabilities). The share shown is the average over those draws. The estimation error of the population parameters is not included.`;
  return note ?? 'No interval.';
}
