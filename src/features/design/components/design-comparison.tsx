import type { CriterionComparison } from '@shared/schemas/redesign';
import { Button } from '@/components/ui/button';
import { Alert, Card } from '@/components/ui/feedback';
import { searchCriteria } from '../utils/criterion-names';
import { formatSignificant } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

type Props = {
  comparison: CriterionComparison[];
  status: 'draft' | 'live' | 'closed';
  currentVersion: number;
  canDecide: boolean;
  busy: boolean;
  onAdopt: () => void;
  onKeep: () => void;
};

/** Relative change of a lower-is-better criterion, e.g. "−18 %". */
function change(current: number | null, candidate: number | null): string {
  if (current === null || candidate === null || current === 0) return '';
  const pct = Math.round(((candidate - current) / current) * 100);
  return `${pct > 0 ? '+' : pct < 0 ? '−' : '±'}${Math.abs(pct)} %`;
}

/**
 * The current and the new design side by side under the NEW priors (every criterion, lower is
 * better), and the decision: adopt the new design or keep the current one.
 */
export function DesignComparison(p: Props) {
  return (
    <Card title="Current design or the new one?">
      <p className="mb-3 text-sm text-ink-soft">
        Both designs scored under the new priors. Lower is better for every criterion.
      </p>
      <DataTable
        look="flush"
        label="Design comparison"
        headings={[
          'Criterion',
          figureHeading('Current'),
          figureHeading('New'),
          figureHeading('Change'),
        ]}
      >
        {p.comparison.map((c) => (
          <tr key={c.criterion} className="border-b border-line/60 align-top">
            <th scope="row" className="py-1.5 pr-3 text-left font-medium text-ink">
              {searchCriteria[c.criterion].name}
              {c.unavailable && (
                <span className="block text-xs font-normal text-ink-muted">{c.unavailable}</span>
              )}
            </th>
            <td className="num py-1.5 pr-3 text-right">{formatSignificant(c.current)}</td>
            <td className="num py-1.5 pr-3 text-right">{formatSignificant(c.candidate)}</td>
            <td className="num py-1.5 text-right">{change(c.current, c.candidate)}</td>
          </tr>
        ))}
      </DataTable>
      {p.status === 'live' && (
        <Alert tone="info" className="mt-4">
          Adopting makes the new design version {p.currentVersion + 1} of this live study. People
          already answering keep version {p.currentVersion}; new respondents get the new tasks.
          Models pool all versions.
        </Alert>
      )}
      {p.canDecide && (
        <div className="mt-4 flex flex-wrap gap-3">
          <Button type="button" busy={p.busy} onClick={p.onAdopt}>
            Adopt the new design
          </Button>
          <Button type="button" variant="secondary" disabled={p.busy} onClick={p.onKeep}>
            Keep the current design
          </Button>
        </div>
      )}
    </Card>
  );
}
