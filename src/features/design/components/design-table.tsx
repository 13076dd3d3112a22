import type { Design } from '@shared/schemas/design';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { getLevelLabel } from '@shared/study/level-labels';
import { DataTable, figureHeading } from '@/components/ui/data-table';

/** The tasks of each block as a compact table: one row per alternative. */
export function DesignTable({
  definition,
  design,
}: {
  definition: StudyDefinition;
  design: Design;
}) {
  const blocks = Array.from({ length: design.blocks }, (_, b) =>
    design.tasks.filter((t) => t.block === b + 1),
  );
  const levelText = (attributeId: string, levelId: string | undefined) => {
    const a = definition.attributes.find((x) => x.id === attributeId);
    const l = a?.levels.find((x) => x.id === levelId);
    return a && l ? getLevelLabel(a, l) : '—';
  };
  return (
    <div className="space-y-6">
      {blocks.map((tasks, b) => (
        <DataTable
          key={b}
          look="flush"
          className="w-full min-w-max text-sm"
          caption={
            <>
              Block {b + 1}{' '}
              <span className="font-normal text-ink-muted">({tasks.length} tasks)</span>
            </>
          }
          captionClassName="mb-1 text-left text-sm font-semibold text-ink"
          headCellClassName="py-1.5 pr-3 font-medium"
          headings={[
            figureHeading('Task'),
            figureHeading('Alt.'),
            ...definition.attributes.map((a) => ({
              label: a.name,
              align: 'left' as const,
              key: a.id,
            })),
          ]}
        >
          {tasks.map((t) =>
            t.alternatives.map((alt, j) => (
              <tr
                key={`${t.task}-${j}`}
                className={j === t.alternatives.length - 1 ? 'border-b border-line' : ''}
              >
                <td className="num py-1 pr-3 text-ink-muted">{j === 0 ? t.task : ''}</td>
                <td className="num py-1 pr-3">{j + 1}</td>
                {definition.attributes.map((a) => (
                  <td key={a.id} className={a.kind === 'numeric' ? 'num py-1 pr-3' : 'py-1 pr-3'}>
                    {levelText(a.id, alt.levels[a.id])}
                  </td>
                ))}
              </tr>
            )),
          )}
        </DataTable>
      ))}
    </div>
  );
}
