import { SelectField } from '@/components/ui/field';
import type { TasteHeader } from '@shared/schemas/tastes';
import type { TastesQuery } from '../api/list-tastes';
import { Options } from '@/components/ui/options';

type Patch = Partial<TastesQuery>;

/** A yes/no filter: all respondents (undefined), only those with the property, or only without. */
function YesNoFilter({
  label,
  value,
  choices: [yes, no],
  onChange,
}: {
  label: string;
  value: boolean | undefined;
  choices: [string, string];
  onChange: (value: boolean | undefined) => void;
}) {
  return (
    <SelectField
      label={label}
      value={value === undefined ? '' : String(value)}
      onChange={(e) => onChange(e.target.value === '' ? undefined : e.target.value === 'true')}
    >
      <option value="">All respondents</option>
      <option value="true">{yes}</option>
      <option value="false">{no}</option>
    </SelectField>
  );
}

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
      <YesNoFilter
        label="Effective draws"
        value={query.lowDraws}
        choices={['Only few draws', 'Without few draws']}
        onChange={(lowDraws) => onChange({ lowDraws, page: 1 })}
      />
      <YesNoFilter
        label="Quality flags"
        value={query.flagged}
        choices={['Only flagged', 'Only unflagged']}
        onChange={(flagged) => onChange({ flagged, page: 1 })}
      />
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
