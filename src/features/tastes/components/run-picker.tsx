import { SelectField } from '@/components/ui/field';
import type { TastesRun } from '@shared/schemas/tastes';
import { MODEL_LABELS } from '@shared/schemas/estimation-families';
import { formatDateTime } from '@/utils/format';
import { Options } from '@/components/ui/options';

const describe = (r: TastesRun) => {
  const when = r.finishedAt ? formatDateTime(r.finishedAt) : '';
  const kind = MODEL_LABELS[r.model] ?? r.model;
  return `${r.name || 'Unnamed run'} — ${kind}, ${when}`;
};

/** Chooses one finished run; `withProfiles` keeps only runs that stored taste profiles. */
export function RunPicker({
  runs,
  value,
  onChange,
  withProfiles = true,
  label = 'Run',
}: {
  runs: TastesRun[];
  value: string;
  onChange: (runId: string) => void;
  withProfiles?: boolean;
  label?: string;
}) {
  const usable = withProfiles ? runs.filter((r) => r.profiles > 0) : runs;
  return (
    <SelectField
      label={label}
      value={value}
      onChange={(e) => onChange(e.target.value)}
      wrapperClassName="w-full sm:max-w-md"
    >
      <Options items={usable.map((r) => ({ value: r.id, label: describe(r) }))} />
    </SelectField>
  );
}
