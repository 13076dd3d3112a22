/**
 * The study's saved scenarios: load one into the editor, tick several to compare them side by
 * side, delete (writers only, after a confirmation).
 */
import { Button } from '@/components/ui/button';
import { CompareCheckbox } from '@/components/ui/checkbox-field';
import { useConfirm } from '@/components/ui/confirm-dialog';
import { formatDateTime } from '@/utils/format';
import type { SavedScenario } from '@shared/schemas/shares';
import { DataTable } from '@/components/ui/data-table';

export function SavedScenarios({
  scenarios,
  loadedId,
  compared,
  canWrite,
  onLoad,
  onToggleCompare,
  onDelete,
}: {
  scenarios: SavedScenario[];
  loadedId: string | null;
  compared: string[];
  canWrite: boolean;
  onLoad: (s: SavedScenario) => void;
  onToggleCompare: (id: string) => void;
  onDelete: (s: SavedScenario) => void;
}) {
  const { confirm, dialog } = useConfirm();
  if (scenarios.length === 0)
    return (
      <p className="text-sm text-ink-soft">
        No saved scenarios yet.{canWrite ? ' Name the scenario above and save it.' : ''}
      </p>
    );
  return (
    <>
      {dialog}
      <DataTable
        className="min-w-full text-sm"
        caption="Saved scenarios"
        headings={[
          'Compare',
          'Scenario',
          { label: 'Saved', align: 'left', className: 'hidden sm:table-cell' },
          { label: <span className="sr-only">Actions</span>, align: 'right', key: 'actions' },
        ]}
      >
        {scenarios.map((s) => (
          <tr key={s.id} className="border-b border-line/60">
            <td className="px-2 py-1">
              <CompareCheckbox
                name={s.name}
                checked={compared.includes(s.id)}
                onToggle={() => onToggleCompare(s.id)}
              />
            </td>
            <td className="px-2 py-1">
              <span className="font-medium text-ink">{s.name}</span>
              {s.id === loadedId && (
                <span className="ml-2 text-xs text-primary">(in the editor)</span>
              )}
              <span className="block text-xs text-ink-muted">
                {s.alternatives.map((a) => a.name).join(' · ')}
                {s.includeFixed ? ' · status quo' : ''}
              </span>
            </td>
            <td className="hidden px-2 py-1 text-xs whitespace-nowrap text-ink-soft sm:table-cell">
              {formatDateTime(s.updatedAt)}
              {s.createdBy ? ` · ${s.createdBy}` : ''}
            </td>
            <td className="px-2 py-1 text-right whitespace-nowrap">
              <div className="flex flex-col items-end sm:flex-row sm:justify-end">
                <Button
                  variant="ghost"
                  size="sm"
                  onClick={() => onLoad(s)}
                  aria-label={`Load ${s.name}`}
                >
                  Load
                </Button>
                {canWrite && (
                  <Button
                    variant="ghost"
                    size="sm"
                    aria-label={`Delete ${s.name}`}
                    onClick={async () => {
                      if (
                        await confirm({
                          title: `Delete “${s.name}”?`,
                          body: 'The saved scenario is removed for the whole team.',
                          confirmLabel: 'Delete scenario',
                          danger: true,
                        })
                      )
                        onDelete(s);
                    }}
                  >
                    Delete
                  </Button>
                )}
              </div>
            </td>
          </tr>
        ))}
      </DataTable>
    </>
  );
}
