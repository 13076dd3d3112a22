import { useVersions } from '../api/get-versions';
import { formatCount, formatDateTime } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

/** Frozen versions with how many respondents saw each. */
export function VersionsList({ teamId, studyId }: { teamId: string; studyId: string }) {
  const { data } = useVersions(teamId, studyId);
  if (!data || data.length === 0) return null;
  return (
    <div>
      <p className="mb-1 text-sm font-medium text-ink">Versions</p>
      <DataTable
        wrapperClassName={false}
        label="Versions"
        headRowClassName="text-left text-xs text-ink-muted"
        headCellClassName="py-1 pr-3 font-medium last:pr-0"
        headings={['Version', 'Frozen', figureHeading('Respondents'), figureHeading('Completes')]}
      >
        {data.map((v) => (
          <tr key={v.version} className="border-t border-line">
            <td className="py-1 pr-3 font-mono tabular-nums">{v.version}</td>
            <td className="py-1 pr-3">{formatDateTime(v.createdAt)}</td>
            <td className="num py-1 pr-3">{formatCount(v.respondents)}</td>
            <td className="num py-1">{formatCount(v.completes)}</td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}
