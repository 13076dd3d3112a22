/** The design of the newest live version as CSV (server/engine/design/export-design-csv.ts). */
import { getLatestVersion } from '../../../db/queries/versions';
import { NotFoundError } from '../../lib/errors';
import { loadStudy } from '../study-access';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import type { Design } from '../../../shared/schemas/design';
import { exportDesignCsv } from '../../engine/design/export-design-csv';
import { makeDownload, type StudyExporter } from './download';

export const exportDesign: StudyExporter = async (deps, actor, studyId, at = new Date()) => {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const version = await getLatestVersion(deps.db, { studyId });
  if (!version) throw new NotFoundError('Frozen design');
  return makeDownload(
    study.name,
    'design',
    'csv',
    at,
    exportDesignCsv(version.definition as StudyDefinition, version.design as Design),
  );
};
