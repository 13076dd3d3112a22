/** Include / exclude one respondent; excluding asks for the reason in place. */
import { useState } from 'react';
import type { ResponseRow } from '@shared/schemas/responses';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { useSetInclusion } from '../api/set-inclusion';

export function InclusionCell({
  teamId,
  studyId,
  row,
  canManage,
}: {
  teamId: string;
  studyId: string;
  row: ResponseRow;
  canManage: boolean;
}) {
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState('');
  const mutation = useSetInclusion(teamId, studyId);
  const error =
    mutation.error instanceof ApiError
      ? (mutation.error.fields[0]?.message ?? mutation.error.message)
      : null;

  if (!canManage)
    return (
      <span className={row.included ? 'text-ink' : 'text-danger'}>
        {row.included ? 'Included' : 'Excluded'}
        {row.exclusionReason && (
          <span className="block text-xs text-ink-muted">{row.exclusionReason}</span>
        )}
      </span>
    );
  if (!row.included)
    return (
      <div className="flex flex-col items-start gap-1">
        <span className="text-sm text-danger">
          Excluded
          <span
            className="block max-w-[14rem] truncate text-xs text-ink-muted"
            title={row.exclusionReason ?? ''}
          >
            {row.exclusionReason}
          </span>
        </span>
        <Button
          size="sm"
          variant="ghost"
          busy={mutation.isPending}
          onClick={() => mutation.mutate({ respondentId: row.id, input: { included: true } })}
        >
          Include again
        </Button>
      </div>
    );
  if (!asking)
    return (
      <Button size="sm" variant="secondary" onClick={() => setAsking(true)}>
        Exclude…
      </Button>
    );
  return (
    <form
      className="flex min-w-[14rem] flex-col gap-1"
      onSubmit={(e) => {
        e.preventDefault();
        mutation.mutate(
          { respondentId: row.id, input: { included: false, reason } },
          { onSuccess: () => setAsking(false) },
        );
      }}
    >
      <label className="text-xs text-ink-soft" htmlFor={`reason-${row.id}`}>
        Reason
      </label>
      <input
        id={`reason-${row.id}`}
        autoFocus
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        aria-invalid={error ? true : undefined}
        className="h-8 rounded-md border border-line px-2 text-sm focus:border-primary focus:outline-none"
      />
      {error && (
        <p role="alert" className="text-xs text-danger">
          {error}
        </p>
      )}
      <div className="flex gap-1">
        <Button type="submit" size="sm" variant="danger" busy={mutation.isPending}>
          Exclude
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setAsking(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
