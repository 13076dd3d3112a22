/**
 * An imported study is read for estimation exactly as a fielded one (loadStudyChoiceData), and
 * gives the MNL the command-line estimator gives on the same file coded by hand; the estimates
 * also recover the simulation's known coefficients.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { syntheticChoiceCsv, syntheticTruth } from '../../../scripts/lib/synthetic-choice-file';
import {
  loadStudyChoiceData,
  toBuiltChoiceData,
  toLongCsvRows,
} from '../../../server/services/choice-data-from-study';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';
import { parseChoiceCsv } from '../../../server/engine/estimation/parse-choice-csv';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { ImportPreview } from '../../../shared/schemas/study-import';

const t = useTestApp();
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
const RESPONDENTS = 600;
const csv = syntheticChoiceCsv(RESPONDENTS);
let studyId = '';

beforeAll(async () => {
  team = await createTeamWithAllRoles(t);
  const attach = (req: ReturnType<typeof team.agents.owner.post>) =>
    req.attach('choices', Buffer.from(csv), { filename: 'choices.csv', contentType: 'text/csv' });
  const preview = (
    await attach(team.agents.owner.post(`/api/teams/${team.teamId}/imports/preview`)).expect(200)
  ).body as ImportPreview;
  expect(preview.problemCount).toBe(0);
  // Code river in dummy coding against "poor", as the simulation does.
  const attributes = preview.attributes.map((a) =>
    a.column === 'river' ? { ...a, referenceRaw: 'poor' } : a,
  );
  const saved = await attach(
    team.agents.owner
      .post(`/api/teams/${team.teamId}/imports`)
      .field('setup', JSON.stringify({ name: 'Imported', attributes })),
  ).expect(201);
  studyId = saved.body.studyId;
}, 60_000);

/** The same file coded by hand in the command-line estimator's format. */
function codedByHand(): string {
  const [, ...lines] = csv.trim().split('\n');
  const coded = lines.map((line) => {
    const [r, task, alt, chosen, bill, interruptions, river, renewables] = line.split(',');
    const fair = river === 'fair' ? 1 : 0;
    const good = river === 'good' ? 1 : 0;
    return [r, task, alt, chosen, bill, interruptions, fair, good, renewables].join(',');
  });
  return ['respondent,task,alt,chosen,bill,interruptions,fair,good,renewables', ...coded].join(
    '\n',
  );
}

describe('estimation on an imported study', () => {
  it('reads every respondent, task and alternative of the file', async () => {
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId });
    expect(prepared.summary).toMatchObject({ respondents: RESPONDENTS, tasks: RESPONDENTS * 12 });
    expect(toLongCsvRows(prepared).rows).toHaveLength(RESPONDENTS * 12 * 3);
  });

  it('gives the MNL of the command-line estimator on the hand-coded file, and recovers the truth', async () => {
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId });
    const keys = prepared.columns.map((c) => c.key);
    const imported = await fitMnl(toBuiltChoiceData(prepared, keys).data);
    const columns = ['bill', 'interruptions', 'fair', 'good', 'renewables'];
    const cli = await fitMnl(buildChoiceData(columns, parseChoiceCsv(codedByHand(), columns)).data);
    expect(imported.loglik).toBeCloseTo(cli.loglik, 6);
    // Same data, same likelihood: the estimates agree to Newton–Raphson's convergence.
    for (let k = 0; k < 5; k++) expect(imported.estimates[k]).toBeCloseTo(cli.estimates[k], 5);
    // Recovery: 7,200 simulated choices; each estimate within 4 standard errors of the truth.
    const truth = [
      syntheticTruth.bill,
      syntheticTruth.interruptions,
      syntheticTruth.riverFair,
      syntheticTruth.riverGood,
      syntheticTruth.renewables,
    ];
    truth.forEach((b, k) =>
      expect(Math.abs(imported.estimates[k] - b)).toBeLessThan(4 * imported.se[k]),
    );
  });
});
