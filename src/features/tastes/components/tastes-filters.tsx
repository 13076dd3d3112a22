import { SelectField } from '@/components/ui/field';
import type { TasteHeader } from '@shared/schemas/tastes';
import type { TastesQuery } from '../api/list-tastes';
import { Options } from '@/components/ui/options';

type Patch = Partial<TastesQuery>;
const tri = (v: boolean | undefined) => (v === undefined ? '' : v ? 'true' : 'false');
const fromTri = (s: string) => (s === '' ? undefined : s === 'true');

/** Sort, quality and background-answer filters of the profile table (all applied on the server). */
export function TastesFilters({
  header,
  query,
  onChange,
}: {
  header: TasteHeader;
  query: TastesQuery;
  onChange: (patch: Patch) => void;
}) {
  const question = header.questions.find((q) => q.key === query.question);
  const filterable = header.questions.filter((q) => q.type === 'single' || q.type === 'multiple');
  const sortOptions = [
    { value: 'number', label: 'Respondent number' },
    { value: 'effectiveDraws', label: 'Effective draws' },
    ...header.coefficients.flatMap((c) => [
      { value: `mean:${c.name}`, label: `${c.label}: mean` },
      { value: `sd:${c.name}`, label: `${c.label}: SD` },
    ]),
    ...header.wtp.map((n) => ({
      value: `wtp:${n}`,
      label: `${header.coefficients.find((c) => c.name === n)?.label ?? n}: WTP`,
    })),
  ];
  return (
    <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
      <SelectField
        label="Sort by"
        value={query.sort}
        onChange={(e) => onChange({ sort: e.target.value, page: 1 })}
      >
        <Options items={sortOptions} />
      </SelectField>
      <SelectField
        label="Order"
        value={query.dir}
        onChange={(e) => onChange({ dir: e.target.value as 'asc' | 'desc', page: 1 })}
      >
        <option value="asc">Ascending</option>
        <option value="desc">Descending</option>
      </SelectField>
      <SelectField
        label="Effective draws"
        value={tri(query.lowDraws)}
        onChange={(e) => onChange({ lowDraws: fromTri(e.target.value), page: 1 })}
      >
        <option value="">All respondents</option>
        <option value="true">Only few draws</option>
        <option value="false">Without few draws</option>
      </SelectField>
      <SelectField
        label="Quality flags"
        value={tri(query.flagged)}
        onChange={(e) => onChange({ flagged: fromTri(e.target.value), page: 1 })}
      >
        <option value="">All respondents</option>
        <option value="true">Only flagged</option>
        <option value="false">Only unflagged</option>
      </SelectField>
      <div className="grid grid-cols-2 gap-2 sm:col-span-2 lg:col-span-1">
        <SelectField
          label="Answer to"
          value={query.question ?? ''}
          onChange={(e) =>
            onChange({ question: e.target.value || undefined, answer: undefined, page: 1 })
          }
        >
          <option value="">Any</option>
          <Options items={filterable.map((q) => ({ value: q.key, label: q.text }))} />
        </SelectField>
        <SelectField
          label="is"
          value={query.answer ?? ''}
          disabled={!question}
          onChange={(e) => onChange({ answer: e.target.value || undefined, page: 1 })}
        >
          <option value="">Choose…</option>
          <Options
            items={(question?.options ?? []).map((o) => ({ value: o.id, label: o.label }))}
          />
        </SelectField>
      </div>
    </div>
  );
}
