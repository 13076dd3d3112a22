/**
 * Command-line estimation: npm run estimate -- --data choices.csv --spec spec.json [--out result.json] [--threads 2]
 * Reads long-format choice data (respondent,task,alt,chosen[,holdout] + numeric attribute
 * columns, and for a latent class model with `membership` the named respondent-level columns)
 * and a specification validated by shared/schemas/estimation-spec.ts, runs the MNL, the panel
 * mixed logit, hierarchical Bayes (model "hb") or the latent class logit (model "latent_class")
 * with individual estimates and WTP, and writes the result JSON (to stdout without --out). The
 * result holds the convergence verdict with the gradient (HB: the sampler's diagnostics), the
 * warnings, and for MNL and mixed logit the full classical and robust covariance matrices.
 * Progress, the verdict and the warnings also go to stderr.
 * Exit codes: 0 done; 2 bad arguments, files, data or specification (the message names the
 * line or field); 3 the model cannot be estimated from the data (not identified, a diverging
 * chain, an empty class); 1 other.
 */
import { runEstimateCli } from './lib/estimate-cli';

void runEstimateCli(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
}).then((code) => {
  process.exitCode = code;
});
