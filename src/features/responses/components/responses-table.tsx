/**
 * Respondents with status, time, flags and the include/exclude decision. External ids and
 * e-mail addresses appear only when the API sent them (roles with personal data access).
 */
import type { ResponseList } from '@shared/schemas/responses';
import { FlagBadges } from './flag-badges';
import { InclusionCell } from './inclusion-cell';
import { formatDateTime, formatDuration } from '@/utils/format';
import { statusLabels } from '../utils/labels';
import { languageName } from '@shared/languages/language-tags';
import { DataTable } from '@/components/ui/data-table';
import { cn } from '@/lib/cn';

/** What both views of the respondent list (this table, and cards on a phone) are given. */
export type ResponseListViewProps = {
  teamId: string;
  studyId: string;
  list: ResponseList;
  canManage: boolean;
};

export function ResponsesTable({ teamId, studyId, list, canManage }: ResponseListViewProps) {
  const personal = list.personalData;
  // The language column only when the study has several.
  const languages = list.languages.length > 1;
  return (
    <DataTable
      look="framed"
      className="w-full min-w-[44rem] text-sm"
      caption="Respondents"
      headings={[
        'Respondent',
        'Status',
        { label: 'Version · block', align: 'right' },
        languages && 'Language',
        { label: 'Time', align: 'right' },
        'Flags',
        personal && 'External id / e-mail',
        'Estimation',
      ]}
    >
      {list.items.map((r) => (
        <tr
          key={r.id}
          className={cn('border-t border-line/60 align-top', !r.included && 'bg-canvas')}
        >
          <th scope="row" className="px-3 py-2 text-left font-normal">
            <span className="font-mono text-xs">{r.id.slice(0, 8)}</span>
            <span className="block text-xs text-ink-muted">{formatDateTime(r.startedAt)}</span>
          </th>
          <td className="px-3 py-2">{statusLabels[r.status]}</td>
          <td className="num px-3 py-2">
            {r.version} · {r.block}
          </td>
          {languages && (
            <td className="px-3 py-2 font-mono text-xs" title={languageName(r.language)}>
              {r.language}
            </td>
          )}
          <td className="num px-3 py-2">{formatDuration(r.durationMs)}</td>
          <td className="px-3 py-2">
            <FlagBadges flags={r.flags} />
          </td>
          {personal && (
            <td className="px-3 py-2 text-xs">
              <span className="block font-mono">{r.externalId ?? '—'}</span>
              {r.email && <span className="block text-ink-soft">{r.email}</span>}
            </td>
          )}
          <td className="px-3 py-2">
            <InclusionCell teamId={teamId} studyId={studyId} row={r} canManage={canManage} />
          </td>
        </tr>
      ))}
    </DataTable>
  );
}
