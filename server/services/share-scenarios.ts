/**
 * Saved share scenarios of a study: everyone with 'runs:read' lists them; owners, editors and
 * analysts ('scenarios:write') save, rename and delete them. A scenario is checked against the
 * study's current definition (the last frozen version, else the draft) when it is saved; one
 * that an edited draft has since invalidated still loads, and the Shares screen says which
 * level is missing when it is simulated.
 */
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError } from '../lib/errors';
import { violatedUniqueIndex } from '../lib/db-errors';
import {
  deleteShareScenario,
  getShareScenario,
  insertShareScenario,
  listShareScenarios,
  updateShareScenario,
  type ShareScenarioRow,
} from '../../db/queries/share-scenarios';
import { getLatestVersion } from '../../db/queries/versions';
import {
  assertScenarioAlternative,
  createScenarioCoder,
} from '../../shared/engine/shares/code-scenario';
import type { SavedScenario, ScenarioAlternative, ScenarioBody } from '../../shared/schemas/shares';
import type { StudyDefinition } from '../../shared/schemas/study-definition';
import { loadStudy } from './study-access';
import { rethrowScenarioError } from './shares/scenario-error';

type Scope = { teamId: string; studyId: string };

const toSaved = (r: ShareScenarioRow): SavedScenario => ({
  id: r.id,
  name: r.name,
  alternatives: r.alternatives as ScenarioAlternative[],
  includeFixed: r.includeFixed,
  createdAt: r.createdAt.toISOString(),
  updatedAt: r.updatedAt.toISOString(),
  createdBy: r.createdBy,
});

async function assertScenarioFits(deps: AppDeps, scope: Scope, body: ScenarioBody) {
  const study = await loadStudy(deps, scope.teamId, scope.studyId);
  const version = await getLatestVersion(deps.db, { studyId: scope.studyId });
  const definition = (version?.definition ?? study.definition) as StudyDefinition;
  const coder = createScenarioCoder(definition, []);
  try {
    body.alternatives.forEach((alt, i) => assertScenarioAlternative(coder, alt, i));
  } catch (e) {
    rethrowScenarioError(e);
  }
}

const nameTaken = (name: string) =>
  new ConflictError('scenario_name_taken', `A scenario named “${name}” already exists.`, [
    { path: 'name', message: 'Choose another name' },
  ]);

/** Lets the unique index decide between two saves of one name. */
async function asNamed<T>(name: string, write: () => Promise<T>): Promise<T> {
  try {
    return await write();
  } catch (e) {
    if (violatedUniqueIndex(e) === 'share_scenarios_study_name_idx') throw nameTaken(name);
    throw e;
  }
}

export async function listScenarios(deps: AppDeps, scope: Scope): Promise<SavedScenario[]> {
  await loadStudy(deps, scope.teamId, scope.studyId);
  return (await listShareScenarios(deps.db, scope)).map(toSaved);
}

async function readScenario(deps: AppDeps, scope: Scope, id: string): Promise<SavedScenario> {
  const row = await getShareScenario(deps.db, { ...scope, id });
  if (!row) throw new NotFoundError('Scenario');
  return toSaved(row);
}

export async function createScenario(
  deps: AppDeps,
  scope: Scope,
  userId: string,
  body: ScenarioBody,
): Promise<SavedScenario> {
  await assertScenarioFits(deps, scope, body);
  const { id } = await asNamed(body.name, () =>
    insertShareScenario(deps.db, { ...scope, ...body, createdBy: userId }),
  );
  return readScenario(deps, scope, id);
}

export async function updateScenario(
  deps: AppDeps,
  scope: Scope,
  id: string,
  body: ScenarioBody,
): Promise<SavedScenario> {
  await assertScenarioFits(deps, scope, body);
  const row = await asNamed(body.name, () =>
    updateShareScenario(deps.db, { ...scope, id, ...body }),
  );
  if (!row) throw new NotFoundError('Scenario');
  return readScenario(deps, scope, id);
}

export async function removeScenario(deps: AppDeps, scope: Scope, id: string): Promise<void> {
  await loadStudy(deps, scope.teamId, scope.studyId);
  if (!(await deleteShareScenario(deps.db, { ...scope, id }))) throw new NotFoundError('Scenario');
}
