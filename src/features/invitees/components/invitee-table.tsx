/** The invitation list: state per person, filters, search and paging. Personal data. */
import { useState } from 'react';
import type { InviteeState } from '@shared/schemas/invitees';
import { Button } from '@/components/ui/button';
import { Pagination } from '@/components/ui/pagination';
import { SelectField, TextField } from '@/components/ui/field';
import { Spinner } from '@/components/ui/feedback';
import { useConfirm } from '@/components/ui/confirm-dialog';
import { ErrorText } from '@/components/ui/error-boundary';
import { useInvitees } from '../api/list-invitees';
import { useDeleteInvitee } from '../api/delete-invitee';
import { MailStatus } from './mail-status';
import { InviteeStateBadge, inviteeStateOptions } from './invitee-state-badge';
import { formatDate } from '@/utils/format';
import { DataTable } from '@/components/ui/data-table';
import { Options } from '@/components/ui/options';
import type { StudyPanelProps } from '@/lib/study-panel';

const PAGE_SIZE = 25;

export function InviteeTable({ teamId, studyId, canManage }: StudyPanelProps) {
  const [state, setState] = useState<InviteeState | ''>('');
  const [search, setSearch] = useState('');
  const [page, setPage] = useState(1);
  const query = {
    state: state || undefined,
    search: search || undefined,
    page,
    pageSize: PAGE_SIZE,
  };
  const list = useInvitees(teamId, studyId, query);
  const remove = useDeleteInvitee(teamId, studyId);
  const { confirm, dialog } = useConfirm();
  const pages = list.data ? Math.max(1, Math.ceil(list.data.total / PAGE_SIZE)) : 1;

  return (
    <div className="space-y-3">
      {dialog}
      <div className="grid gap-2 sm:grid-cols-[12rem_1fr]">
        <SelectField
          label="Show"
          value={state}
          onChange={(e) => {
            setState(e.target.value as InviteeState | '');
            setPage(1);
          }}
        >
          <option value="">Everybody</option>
          <Options items={inviteeStateOptions} />
        </SelectField>
        <TextField
          label="Search"
          type="search"
          placeholder="E-mail, name or external id"
          value={search}
          onChange={(e) => {
            setSearch(e.target.value);
            setPage(1);
          }}
        />
      </div>
      {list.isPending && <Spinner />}
      <ErrorText error={list.error ?? remove.error} />
      {list.data && list.data.total === 0 && (
        <p className="text-sm text-ink-muted">
          Nobody on the list{state || search ? ' matches' : ' yet'}.
        </p>
      )}
      {list.data && list.data.total > 0 && (
        <DataTable
          look="framed"
          className="w-full min-w-[40rem] text-sm"
          caption="Invitees"
          headings={[
            'E-mail',
            'Name',
            'External id',
            'State',
            'Mail',
            { label: 'Invited', align: 'right' },
            { label: 'Reminders', align: 'right' },
            canManage && {
              label: <span className="sr-only">Actions</span>,
              align: 'left',
              key: 'actions',
            },
          ]}
        >
          {list.data.items.map((i) => (
            <tr key={i.id} className="border-t border-line/60">
              <td className="px-3 py-1.5">{i.email}</td>
              <td className="px-3 py-1.5">{i.name || '—'}</td>
              <td className="px-3 py-1.5 font-mono text-xs">{i.externalId ?? '—'}</td>
              <td className="px-3 py-1.5">
                <InviteeStateBadge state={i.state} />
              </td>
              <td className="max-w-64 px-3 py-1.5">
                <MailStatus mail={i.mail} />
              </td>
              <td className="num px-3 py-1.5">{formatDate(i.invitedAt)}</td>
              <td className="num px-3 py-1.5">{i.reminderCount}</td>
              {canManage && (
                <td className="px-3 py-1 text-right">
                  <Button
                    size="sm"
                    variant="ghost"
                    aria-label={`Remove ${i.email} from the list`}
                    onClick={() =>
                      void confirm({
                        title: `Remove ${i.email}?`,
                        body: 'They leave the invitation list and get no further invitations or reminders.',
                        confirmLabel: 'Remove',
                        danger: true,
                      }).then((ok) => ok && remove.mutate(i.id))
                    }
                  >
                    Remove
                  </Button>
                </td>
              )}
            </tr>
          ))}
        </DataTable>
      )}
      {list.data && pages > 1 && (
        <Pagination label="Invitee pages" page={page} pages={pages} onPage={setPage}>
          <span className="num text-ink-soft">
            {page} / {pages}
          </span>
        </Pagination>
      )}
    </div>
  );
}
