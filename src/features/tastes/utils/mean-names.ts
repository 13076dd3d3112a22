import type { TastesRun } from '@shared/schemas/tastes';

/** What a run's individual means are called, per model family. */
export const MEAN_NAMES: Record<TastesRun['model'], string> = {
  mnl: 'estimate',
  mixed: 'conditional mean',
  hb: 'posterior mean',
  latent_class: 'posterior-weighted mean',
};
