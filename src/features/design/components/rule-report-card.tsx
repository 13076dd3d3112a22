/**
 * How the design stands against every rule: dominance screening (switched on or off),
 * excluded combinations, appearances per level, overlap and block balance. Levels that never
 * appear are errors. Designs stored before the rules were reported show only what they have.
 */
import type { DesignDiagnostics, DominanceRuleName } from '@shared/schemas/design-diagnostics';
import { Alert, Card } from '@/components/ui/feedback';
import { DataTable, figureHeading } from '@/components/ui/data-table';

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function dominanceLabel(rule: DominanceRuleName, fixedName: string): string {
  if (rule === 'betweenDesigned') return 'An option dominates another option of its task';
  if (rule === 'overFixed') return `An option dominates ${fixedName}`;
  return `${fixedName} dominates an option`;
}

function ruleState(active: boolean | null, applies: boolean): string {
  if (!applies) return 'cannot be judged';
  if (active === null) return 'not applied (imported)';
  return active ? 'on' : 'off';
}

export function RuleReportCard({
  d,
  fixedLabel,
}: {
  d: DesignDiagnostics;
  /** Name of the opt-out / status quo, or null when the study has none. */
  fixedLabel: string | null;
}) {
  const errors = d.errors ?? [];
  const report = d.rules;
  if (!report && errors.length === 0) return null;
  const fixedName = `“${fixedLabel ?? 'the opt-out'}”`;
  const dominance = report?.dominance.filter((r) => fixedLabel || r.rule === 'betweenDesigned');
  return (
    <Card title="Rules">
      {errors.length > 0 && (
        <Alert tone="danger" className="mb-3">
          <ul className="list-disc space-y-1 pl-4">
            {errors.map((e) => (
              <li key={e}>{e}</li>
            ))}
          </ul>
        </Alert>
      )}
      {report && (
        <div className="space-y-4 text-sm">
          <DataTable
            wrapperClassName={false}
            className="w-full text-xs"
            caption="Dominance under the priors’ signs"
            captionClassName="mb-1 text-left text-sm font-medium text-ink"
            headRowClassName="border-b border-line text-left text-ink-muted"
            headCellClassName="py-1 pr-2 font-medium last:pr-0"
            headings={['Case', 'Rule', figureHeading('Tasks'), figureHeading('Options')]}
          >
            {dominance?.map((r) => (
              <tr key={r.rule} className="border-b border-line/60">
                <td className="py-1 pr-2">{dominanceLabel(r.rule, fixedName)}</td>
                <td className="py-1 pr-2 text-ink-soft">{ruleState(r.active, r.applies)}</td>
                <td className="num py-1 pr-2 text-right">{r.applies ? r.tasks : '—'}</td>
                <td className="num py-1 text-right">{r.applies ? r.alternatives : '—'}</td>
              </tr>
            ))}
          </DataTable>
          {!report.dominanceKnown && (
            <p className="text-xs text-ink-muted">
              No prior has a known sign, so dominance cannot be judged. Give priors to screen it.
            </p>
          )}
          {report.excludedCombinations.length > 0 && (
            <div>
              <h3 className="mb-1 font-medium text-ink">Excluded combinations</h3>
              <ul className="space-y-1 text-xs">
                {report.excludedCombinations.map((x) => (
                  <li key={x.id} className="flex justify-between gap-2">
                    <span>{x.text}</span>
                    <span
                      className={x.breaches > 0 ? 'font-semibold text-danger' : 'text-ink-muted'}
                    >
                      {x.breaches > 0 ? `broken ${plural(x.breaches, 'time')}` : 'kept'}
                    </span>
                  </li>
                ))}
              </ul>
            </div>
          )}
          <div>
            <h3 className="mb-1 font-medium text-ink">Levels, overlap and blocks</h3>
            <ul className="space-y-1 text-xs">
              {report.balance.rules && (
                <li>
                  Each level at least {plural(report.balance.rules.minAppearances, 'time')}
                  {report.balance.rules.levelBalance ? ', levels balanced' : ''}:{' '}
                  {report.balance.levelsBelowMinimum === 0
                    ? 'kept'
                    : `${plural(report.balance.levelsBelowMinimum, 'level')} below`}
                </li>
              )}
              {report.balance.rules?.maxOverlap !== null &&
                report.balance.rules?.maxOverlap !== undefined && (
                  <li>
                    At most {plural(report.balance.rules.maxOverlap, 'attribute')} alike in all
                    options of a task:{' '}
                    {report.balance.tasksOverOverlap === 0
                      ? 'kept'
                      : `${plural(report.balance.tasksOverOverlap, 'task')} over`}
                  </li>
                )}
              <li>
                Blocks {report.blocks.balanced ? 'balanced' : 'not balanced'}
                {report.blocks.worst && (
                  <>
                    {' '}
                    (largest gap: {report.blocks.worst.attribute} “{report.blocks.worst.level}” in
                    block {report.blocks.worst.block}, {report.blocks.worst.count} against a fair{' '}
                    {report.blocks.worst.fair.toFixed(1)})
                  </>
                )}
              </li>
            </ul>
          </div>
        </div>
      )}
    </Card>
  );
}
