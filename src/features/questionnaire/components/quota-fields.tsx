/**
 * Segment quotas of a screening question: cells of accepted answers, each with a target of
 * completes. The same partition checks as the server's (shared/survey/quota-cells.ts) run as
 * the researcher types, so a gap or overlap is named before saving.
 */
import { nanoid } from 'nanoid';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { TextField } from '@/components/ui/field';
import { NumberRangeFields } from '@/components/ui/number-range-fields';
import { NumberTextField } from '@/components/ui/number-text-field';
import { OptionCheckboxes } from './option-checkboxes';
import type { QuotaCell, ScreeningPage } from '@shared/schemas/questionnaire';
import { acceptedRange, quotaProblems } from '@shared/survey/quota-cells';

export const quotaHelp =
  'Set how many completes you need from each group. Once a group is full, its next respondents leave at this question as over quota (and go to the panel’s over-quota link, if set). Every accepted answer must belong to exactly one group.';

export function QuotaFields({
  page,
  onChange,
}: {
  page: ScreeningPage;
  onChange: (page: ScreeningPage) => void;
}) {
  const q = page.question;
  if (q.type !== 'single' && q.type !== 'number')
    return (
      <p className="text-sm text-ink-soft">
        Quotas need a single-choice or number screening question.
      </p>
    );
  const cells = page.quotaCells;
  const setCell = (id: string, patch: Partial<QuotaCell>) =>
    onChange({ ...page, quotaCells: cells.map((c) => (c.id === id ? { ...c, ...patch } : c)) });
  const range = acceptedRange(page);
  const addCell = () =>
    onChange({
      ...page,
      quotaCells: [
        ...cells,
        {
          id: nanoid(8),
          label: `Group ${cells.length + 1}`,
          optionIds: [],
          from: range ? range.lo : null,
          to: range ? range.hi : null,
          target: 100,
        },
      ],
    });
  const problems = quotaProblems(page);
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-medium text-ink">Quotas per group</legend>
      <p className="text-sm text-ink-soft">{quotaHelp}</p>
      {cells.map((cell, i) => (
        <div key={cell.id} className="space-y-3 rounded-md border border-line p-3">
          <div className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
            <TextField
              label={`Group ${i + 1} name`}
              value={cell.label}
              onChange={(e) => setCell(cell.id, { label: e.target.value })}
            />
            <NumberTextField
              label="Completes wanted"
              integer
              required
              range={{ min: 1, max: 1_000_000 }}
              value={cell.target}
              onCommit={(target) => setCell(cell.id, { target: target ?? cell.target })}
            />
          </div>
          {q.type === 'single' ? (
            <div className="space-y-1" role="group" aria-label={`Answers in ${cell.label}`}>
              <OptionCheckboxes
                options={q.options.filter((o) => !page.screenOutOptionIds.includes(o.id))}
                selected={cell.optionIds}
                onChange={(optionIds) => setCell(cell.id, { optionIds })}
              />
            </div>
          ) : (
            <NumberRangeFields
              labels={{ low: 'From', high: 'To (inclusive)' }}
              integer
              limits={{ low: cell.from, high: cell.to }}
              onCommit={({ low, high }) => setCell(cell.id, { from: low, to: high })}
            />
          )}
          <Button
            variant="ghost"
            size="sm"
            aria-label={`Remove group ${i + 1}`}
            onClick={() => onChange({ ...page, quotaCells: cells.filter((c) => c.id !== cell.id) })}
          >
            Remove group
          </Button>
        </div>
      ))}
      <Button variant="secondary" size="sm" onClick={addCell} disabled={cells.length >= 20}>
        Add a quota group
      </Button>
      {problems.length > 0 && (
        <Alert tone="warning">
          <ul className="list-disc space-y-1 pl-5">
            {problems.map((p) => (
              <li key={`${p.path.join('.')}:${p.message}`}>{p.message}</li>
            ))}
          </ul>
        </Alert>
      )}
    </fieldset>
  );
}
