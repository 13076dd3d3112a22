/**
 * The team's audit trail for owners: who did what and when, filtered by kind of event, person
 * and dates, newest first, with "load older" paging and a CSV download of the same filters.
 */
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Alert, EmptyState, Spinner } from '@/components/ui/feedback';
import { auditGroups } from '@shared/schemas/audit';
import { auditQueryString, useAudit, type AuditFilters } from '../api/get-audit';
import { describeAuditEvent } from '../utils/describe-event';
import { HeaderCells } from '@/components/ui/header-cells';
import { formatTimestamp } from '@/utils/format';
import { Options } from '@/components/ui/options';

const groupLabels: Record<(typeof auditGroups)[number], string> = {
  auth: 'Sign-ins and passwords',
  member: 'Members and roles',
  invitation: 'Invitations',
  study: 'Study status',
  respondent: 'Exclusions and erasures',
  run: 'Estimation runs',
  export: 'Personal-data downloads',
  audit: 'Audit downloads',
};

/** yyyy-mm-dd from a date input → the start (or end) of that day, as ISO with offset. */
const dayBound = (day: string, end: boolean) =>
  day ? new Date(`${day}T${end ? '23:59:59.999' : '00:00:00'}`).toISOString() : undefined;

export function AuditLog({
  teamId,
  members,
}: {
  teamId: string;
  members: { id: string; name: string }[];
}) {
  const [group, setGroup] = useState('');
  const [actorId, setActorId] = useState('');
  const [fromDay, setFromDay] = useState('');
  const [toDay, setToDay] = useState('');
  const filters: AuditFilters = {
    action: (group || undefined) as AuditFilters['action'],
    actorId: actorId || undefined,
    from: dayBound(fromDay, false),
    to: dayBound(toDay, true),
  };
  const audit = useAudit(teamId, filters);
  const events = audit.data?.pages.flatMap((p) => p.events) ?? [];

  return (
    <div className="space-y-4">
      <form
        aria-label="Filter the audit trail"
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => e.preventDefault()}
      >
        <label className="flex flex-col text-sm">
          <span className="mb-1 font-medium text-ink">Kind of event</span>
          <select
            className="h-9 rounded-md border border-line bg-white px-2"
            value={group}
            onChange={(e) => setGroup(e.target.value)}
          >
            <option value="">All events</option>
            <Options items={auditGroups.map((g) => ({ value: g, label: groupLabels[g] }))} />
          </select>
        </label>
        <label className="flex flex-col text-sm">
          <span className="mb-1 font-medium text-ink">Person</span>
          <select
            className="h-9 rounded-md border border-line bg-white px-2"
            value={actorId}
            onChange={(e) => setActorId(e.target.value)}
          >
            <option value="">Everyone</option>
            <Options items={members.map((m) => ({ value: m.id, label: m.name }))} />
          </select>
        </label>
        <DayInput label="From" value={fromDay} onChange={setFromDay} />
        <DayInput label="To" value={toDay} onChange={setToDay} />
        <a
          className="inline-flex h-9 items-center rounded-md border border-line bg-white px-3 text-sm font-medium text-ink hover:border-primary hover:text-primary"
          href={`/api/teams/${teamId}/audit/export.csv${auditQueryString(filters)}`}
          download
        >
          Download CSV
        </a>
      </form>
      {audit.isPending ? (
        <Spinner />
      ) : audit.error ? (
        <Alert tone="danger">{audit.error.message}</Alert>
      ) : events.length === 0 ? (
        <EmptyState title="No events match these filters" />
      ) : (
        <>
          {/* Phones: one block per event, so nothing hides behind a sideways scroll. */}
          <ul className="divide-y divide-line rounded-md border border-line bg-white sm:hidden">
            {events.map((e) => (
              <li key={e.id} className="px-3 py-2 text-sm">
                <p className="text-ink">{describeAuditEvent(e)}</p>
                <p className="text-xs text-ink-muted">
                  {e.actorEmail ?? 'System or unknown'} · {formatTimestamp(e.at)}
                </p>
              </li>
            ))}
          </ul>
          <div className="hidden overflow-x-auto rounded-md border border-line bg-white sm:block">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Audit trail, newest first</caption>
              <thead className="border-b border-line bg-canvas text-xs uppercase text-ink-muted">
                <tr>
                  <HeaderCells className="px-3 py-2" headings={['When', 'Who', 'What']} />
                </tr>
              </thead>
              <tbody className="divide-y divide-line">
                {events.map((e) => (
                  <tr key={e.id}>
                    <td className="whitespace-nowrap px-3 py-2 font-mono tabular-nums text-ink-soft">
                      {formatTimestamp(e.at)}
                    </td>
                    <td className="px-3 py-2">{e.actorEmail ?? 'System or unknown'}</td>
                    <td className="px-3 py-2">{describeAuditEvent(e)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      {audit.hasNextPage && (
        <Button
          variant="secondary"
          busy={audit.isFetchingNextPage}
          onClick={() => void audit.fetchNextPage()}
        >
          Load older events
        </Button>
      )}
    </div>
  );
}

/** One end of the date range filter (a calendar day). */
function DayInput(props: { label: string; value: string; onChange: (day: string) => void }) {
  return (
    <label className="flex flex-col text-sm">
      <span className="mb-1 font-medium text-ink">{props.label}</span>
      <input
        type="date"
        className="h-9 rounded-md border border-line px-2"
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
      />
    </label>
  );
}
