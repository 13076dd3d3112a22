/** The randomisation-record download (exports/randomisation-table.ts): no personal columns. */
import { loadStudy } from '../study-access';
import { listStudyRespondents } from '../../../db/queries/study-respondents';
import { z } from 'zod';
import { writeCsv } from '../../lib/safe-csv';
import { makeDownload, type StudyExporter } from './download';
import { buildRandomisationRows, randomisationHeader } from './randomisation-table';

const attributeNamesSchema = z.object({
  attributes: z.array(z.object({ id: z.string(), name: z.string() })),
});

export const exportRandomisationCsv: StudyExporter = async (
  deps,
  actor,
  studyId,
  at = new Date(),
) => {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const respondents = await listStudyRespondents(deps.db, { studyId });
  // Attribute ids never change once made, so the study's current names label every version;
  // only ids and names are read, so a draft that does not validate yet still names them.
  const definition = attributeNamesSchema.safeParse(study.definition);
  const names = new Map(
    definition.success ? definition.data.attributes.map((a) => [a.id, a.name]) : [],
  );
  return makeDownload(
    study.name,
    'randomisation',
    'csv',
    at,
    writeCsv(randomisationHeader, buildRandomisationRows(respondents, names)),
  );
};
