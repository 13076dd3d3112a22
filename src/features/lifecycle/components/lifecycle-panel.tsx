import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Alert, Card, Spinner } from '@/components/ui/feedback';
import { useConfirm, type ConfirmRequest } from '@/components/ui/confirm-dialog';
import { ErrorText } from '@/components/ui/error-boundary';
import { ApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';
import type { LifecycleAction } from '@shared/schemas/study-lifecycle';
import { useLifecycle } from '../api/get-lifecycle';
import { useReadiness } from '../api/get-readiness';
import { useChangeStatus } from '../api/change-status';
import { SettingsForm } from './settings-form';
import { VersionsList } from './versions-list';
import type { StudyPanelProps } from '@/lib/study-panel';

const closedReasons = {
  manual: 'by hand',
  date: 'at its close date',
  quota: 'when the quota of completes was reached',
} as const;

function PublicLink({ publicId, panelParam }: { publicId: string; panelParam: string }) {
  const [copied, setCopied] = useState(false);
  const url = `${window.location.origin}${paths.respond.getHref(publicId)}`;
  return (
    <div className="space-y-1">
      <p className="text-sm font-medium text-ink">Public link</p>
      <div className="flex flex-wrap items-center gap-2">
        <code className="min-w-0 flex-1 truncate rounded-md border border-line bg-canvas px-3 py-2 font-mono text-sm">
          {url}
        </code>
        <Button
          variant="secondary"
          size="sm"
          onClick={() =>
            void navigator.clipboard?.writeText(url).then(() => {
              setCopied(true);
              setTimeout(() => setCopied(false), 2000);
            })
          }
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
      <p className="text-xs text-ink-muted">
        Panels add <span className="font-mono">?{panelParam}=…</span>; personal links from
        invitations add <span className="font-mono">?inv=…</span>.
      </p>
    </div>
  );
}

/** Readiness problems, warnings or a refusal: one alert with a bulleted list of messages. */
function MessageList({
  tone,
  title,
  items,
}: {
  tone: 'warning' | 'info' | 'danger';
  title: string;
  items: Array<{ message: string }>;
}) {
  return (
    <Alert tone={tone} title={title}>
      <ul className="list-disc space-y-1 pl-5">
        {items.map((p, i) => (
          <li key={i}>{p.message}</li>
        ))}
      </ul>
    </Alert>
  );
}

/** Status, readiness and the lifecycle actions of a study, with its links and fieldwork settings. */
export function LifecyclePanel({ teamId, studyId, canManage }: StudyPanelProps) {
  const state = useLifecycle(teamId, studyId);
  const isDraft = state.data?.status === 'draft';
  const readiness = useReadiness(teamId, studyId, state.data?.status !== 'live');
  const change = useChangeStatus(teamId, studyId);
  const { confirm, dialog } = useConfirm();
  if (state.isPending) return <Spinner label="Loading the study's state…" />;
  if (state.error) return <ErrorText error={state.error} />;
  const s = state.data;
  const problems = readiness.data?.problems ?? [];
  const warnings = readiness.data?.warnings ?? [];
  const act = async (action: LifecycleAction, ask?: ConfirmRequest) => {
    if (ask && !(await confirm(ask))) return;
    change.mutate(action);
  };
  const serverProblems =
    change.error instanceof ApiError && change.error.code === 'not_ready'
      ? change.error.fields
      : [];

  return (
    <Card title="Go live and fieldwork">
      <div className="space-y-5">
        <p className="text-sm text-ink-soft">
          {s.status === 'draft' &&
            'Draft: respondents cannot answer yet. Going live freezes the attributes, design and questionnaire as a new version.'}
          {s.status === 'live' &&
            `Live since version ${s.currentVersion}: ${s.completes} complete${s.completes === 1 ? '' : 's'} so far. The study is frozen; close it to change anything.`}
          {s.status === 'closed' &&
            `Closed ${closedReasons[s.settings.closedReason ?? 'manual']}, with ${s.completes} complete${s.completes === 1 ? '' : 's'}. Reopen to take more answers, or return it to draft to edit; edits become a new version.`}
        </p>
        {s.status !== 'live' && problems.length > 0 && (
          <MessageList tone="warning" title="Before going live" items={problems} />
        )}
        {s.status !== 'live' && warnings.length > 0 && (
          <MessageList
            tone="info"
            title="Worth a check (going live is not refused)"
            items={warnings}
          />
        )}
        {serverProblems.length > 0 && problems.length === 0 && (
          <MessageList tone="danger" title="The study could not go live" items={serverProblems} />
        )}
        {change.error && serverProblems.length === 0 && <ErrorText error={change.error} />}
        {canManage && (
          <div className="flex flex-wrap gap-2">
            {isDraft && (
              <Button
                busy={change.isPending}
                disabled={problems.length > 0 || readiness.isPending}
                onClick={() =>
                  void act('go-live', {
                    title: 'Go live?',
                    body: `Respondents can answer from now on, and the attributes, design and questionnaire are frozen until you close the study.${warnings.length ? ' Some translations were made from an earlier source wording (see above).' : ''}`,
                    confirmLabel: 'Go live',
                  })
                }
              >
                Go live
              </Button>
            )}
            {s.status === 'live' && (
              <Button
                variant="danger"
                busy={change.isPending}
                onClick={() =>
                  void act('close', {
                    title: 'Close the study?',
                    body: 'Respondents still answering will be stopped. You can reopen it later.',
                    confirmLabel: 'Close now',
                    danger: true,
                  })
                }
              >
                Close now
              </Button>
            )}
            {s.status === 'closed' && (
              <>
                <Button
                  busy={change.isPending}
                  disabled={problems.length > 0}
                  onClick={() => void act('reopen')}
                >
                  Reopen
                </Button>
                <Button
                  variant="secondary"
                  busy={change.isPending}
                  onClick={() => void act('return-to-draft')}
                >
                  Return to draft to edit
                </Button>
              </>
            )}
          </div>
        )}
        <p className="text-xs text-ink-muted">
          Surveys of people need informed consent and often ethics approval and data-protection
          compliance: follow your ethics board and local law before going live.
        </p>
        <PublicLink publicId={s.publicId} panelParam={s.settings.panelParam} />
        <SettingsForm
          teamId={teamId}
          studyId={studyId}
          settings={s.settings}
          canManage={canManage}
        />
        <VersionsList teamId={teamId} studyId={studyId} />
      </div>
      {dialog}
    </Card>
  );
}
