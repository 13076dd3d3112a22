/**
 * A what-if scenario, and optionally its demand curve, as files: recomputed on the server with
 * the same shared code the browser runs (shared/engine/shares), so the file holds the numbers
 * on screen. XLSX: About, Shares, Segments (when split), Demand curve (when swept), Codebook.
 * CSV: the demand curve when one is asked for, else the shares.
 */
import type { AppDeps } from '../../deps';
import { sweepDemandCurve } from '../../../shared/engine/shares/demand-curve';
import { getLevelLabel } from '../../../shared/study/level-labels';
import type { ShareExport } from '../../../shared/schemas/shares';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { getRunSummary } from '../exports/run-summary';
import { col, type DocumentedTable, writeDocumentedCsv } from '../exports/documented-table';
import { addCodebookSheet, addTableSheet, createResultsWorkbook } from '../exports/documented-xlsx';
import { makeDownload, type Download } from '../exports/download';
import { loadPreparedShareModel, loadScenarioGroups, simulateScenario } from '../shares';
import { rethrowScenarioError } from './scenario-error';
import type { Actor } from '../actor';

const INTERVAL_TEXT = {
  parameter: 'Krinsky–Robb: percentiles over draws of the estimates from their covariance',
  conditional:
    'Percentiles over draws from each respondent’s conditional distribution (share = mean over the draws)',
};

/** "Monthly bill increase: €6; River health rating: Good; …" */
export function describeLevels(
  definition: StudyDefinition,
  levels: Record<string, string>,
): string {
  return definition.attributes
    .flatMap((a) => {
      const level = a.levels.find((l) => l.id === levels[a.id]);
      return level ? [`${a.name}: ${getLevelLabel(a, level)}`] : [];
    })
    .join('; ');
}

const intervalColumns = [
  col('lower95', 'ratio', 'Lower end of the 95 % interval of the share', 'proportion'),
  col('upper95', 'ratio', 'Upper end of the 95 % interval of the share', 'proportion'),
];

export async function exportShares(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: ShareExport,
  at = new Date(),
): Promise<Download> {
  const { ctx, prepared, profiles } = await loadPreparedShareModel(
    deps,
    actor,
    studyId,
    input.runId,
  );
  const groups = await loadScenarioGroups(
    deps,
    ctx,
    profiles,
    prepared.model.method,
    input.segmentBy,
  );
  const result = simulateScenario(prepared, input, groups);
  let curve = null;
  try {
    if (input.sweep) curve = sweepDemandCurve(prepared, input, input.sweep);
  } catch (e) {
    rethrowScenarioError(e);
  }
  const tables: DocumentedTable[] = [
    {
      name: 'shares',
      columns: [
        col('alternative', 'text', 'Alternative of the scenario'),
        col('share', 'ratio', 'Predicted share', 'proportion'),
        ...intervalColumns,
        col(
          'share_at_point_values',
          'ratio',
          'Share at the point values (estimates or conditional means)',
          'proportion',
        ),
      ],
      rows: result.names.map((name, j) => [
        name,
        result.shares[j],
        result.lower?.[j] ?? null,
        result.upper?.[j] ?? null,
        result.pointShares[j],
      ]),
    },
  ];
  if (groups && result.groups) {
    const g = result.groups;
    tables.push({
      name: 'segments',
      columns: [
        col('segment', 'text', `Segment: ${groups.label}`),
        col('respondents', 'integer', 'Respondents in the segment', 'respondents'),
        col('alternative', 'text', 'Alternative of the scenario'),
        col('share', 'ratio', 'Predicted share in the segment', 'proportion'),
      ],
      rows: groups.groups.flatMap((group, i) =>
        g.counts[i] > 0
          ? result.names.map((name, j) => [group.label, g.counts[i], name, g.shares[i][j]])
          : [],
      ),
    });
  }
  if (curve) {
    const attribute = ctx.definition.attributes.find((a) => a.id === curve.attributeId)!;
    const unit = attribute.unit?.trim() ?? '';
    tables.push({
      name: 'demand_curve',
      columns: [
        col(
          'value',
          attribute.isCost ? 'money' : 'estimate',
          `${attribute.name} (value swept)`,
          unit || 'none',
        ),
        col('level', 'text', 'Level of the attribute (empty between levels)'),
        col(
          'share',
          'ratio',
          `Predicted share of ${result.names[curve.alternative]}`,
          'proportion',
        ),
        ...intervalColumns,
      ],
      rows: curve.points.map((p) => {
        const level = p.levelId ? attribute.levels.find((l) => l.id === p.levelId) : undefined;
        return [
          level ? (level.value ?? p.value) : p.value,
          level ? getLevelLabel(attribute, level) : null,
          p.share,
          p.lower,
          p.upper,
        ];
      }),
    });
  }
  const kind = curve ? 'demand-curve' : 'shares';
  if (input.format === 'csv') {
    const table = curve ? tables[tables.length - 1] : tables[0];
    return makeDownload(ctx.study.name, kind, 'csv', at, writeDocumentedCsv(table));
  }
  const workbook = createResultsWorkbook(at, [
    ['Scenario', input.name || 'not saved'],
    ...input.alternatives.map(
      (alt, j) =>
        [`Alternative ${j + 1}`, `${alt.name}: ${describeLevels(ctx.definition, alt.levels)}`] as [
          string,
          string,
        ],
    ),
    [
      'Share interval',
      result.interval
        ? `95 %, ${INTERVAL_TEXT[result.interval]}`
        : (prepared.model.intervalNote ?? 'none'),
    ],
    [
      'Interval draws',
      prepared.draws ? `${prepared.draws.draws}, seed ${prepared.model.seed}` : 'none',
    ],
    ...getRunSummary(ctx, at),
  ]);
  const titles: Record<string, string> = {
    shares: 'Shares',
    segments: 'Segments',
    demand_curve: 'Demand curve',
  };
  for (const t of tables) addTableSheet(workbook, titles[t.name], t, ctx.header.costUnit);
  addCodebookSheet(workbook, tables);
  return makeDownload(
    ctx.study.name,
    kind,
    'xlsx',
    at,
    Buffer.from(await workbook.xlsx.writeBuffer()),
  );
}
