/**
 * Fieldwork section: the study's status, link and closing rules (the lifecycle panel), live
 * progress (refreshing on its own while the study is live), where respondents stop, completes
 * per block and version, and invitations by e-mail.
 */
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { Alert, Card, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useFieldworkStats } from '@/features/fieldwork/api/get-fieldwork-stats';
import { fieldworkKeys, LIVE_REFRESH_MS } from '@/features/fieldwork/api/fieldwork-keys';
import { SampleFlow } from '@/features/fieldwork/components/sample-flow';
import { DropOffTable } from '@/features/fieldwork/components/drop-off-table';
import { CompletesBreakdown } from '@/features/fieldwork/components/completes-breakdown';
import { DailyChart } from '@/features/fieldwork/components/daily-chart';
import { QuotaProgressList } from '@/features/fieldwork/components/quota-progress';
import { InvitationSummary } from '@/features/fieldwork/components/invitation-summary';
import { InviteeUpload } from '@/features/invitees/components/invitee-upload';
import { SendPanel } from '@/features/invitees/components/send-panel';
import { useStudy } from '@/features/studies/api/get-study';
import { useQuestionnaire } from '@/features/questionnaire/api/get-questionnaire';
import { statedDuration } from '@shared/mail/invitation-wording';
import { InviteeTable } from '@/features/invitees/components/invitee-table';
import { LifecyclePanel } from '@/features/lifecycle/components/lifecycle-panel';
import { useLifecycle } from '@/features/lifecycle/api/get-lifecycle';
import { formatTime } from '@/utils/format';
import { SectionHeader } from '@/components/ui/section-header';

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const qc = useQueryClient();
  const stats = useFieldworkStats(teamId, studyId);
  // What the invitation preview names: the public title and the consent page's duration.
  const studyTitle = useStudy(teamId, studyId).data?.publicTitle ?? '';
  const consent = useQuestionnaire(teamId, studyId).data?.questionnaire.pages.find(
    (p) => p.kind === 'consent',
  );
  const duration = statedDuration(consent?.kind === 'consent' ? consent.body : '');
  const refreshStats = () =>
    void qc.invalidateQueries({ queryKey: fieldworkKeys.stats(teamId, studyId) });
  // Going live or closing in the panel below changes whether the figures keep refreshing.
  const lifecycleStatus = useLifecycle(teamId, studyId).data?.status;
  const statsStatus = stats.data?.status;
  useEffect(() => {
    if (lifecycleStatus && statsStatus && lifecycleStatus !== statsStatus)
      void qc.invalidateQueries({ queryKey: fieldworkKeys.stats(teamId, studyId) });
  }, [lifecycleStatus, statsStatus, qc, teamId, studyId]);

  if (stats.isPending) return <Spinner label="Loading fieldwork figures…" />;
  if (stats.error) return <ErrorText error={stats.error} />;
  const s = stats.data;
  const live = s.status === 'live';
  // Going live comes first while a draft; afterwards the figures do, with the panel below them.
  const lifecyclePanel = (
    <PanelErrorBoundary title="The study status could not be shown">
      <LifecyclePanel teamId={teamId} studyId={studyId} canManage={can('fieldwork:manage')} />
    </PanelErrorBoundary>
  );

  return (
    <div className="space-y-6">
      <SectionHeader
        title="Fieldwork"
        description={
          live
            ? `Live. Figures refresh every ${LIVE_REFRESH_MS / 1000} seconds.`
            : s.status === 'closed'
              ? 'Closed. These are the final figures.'
              : 'Draft. Figures appear once the study is live.'
        }
      >
        <p className="text-xs text-ink-muted" aria-live="polite">
          Updated <span className="font-mono">{formatTime(s.generatedAt)}</span>
        </p>
      </SectionHeader>

      {s.status === 'draft' && lifecyclePanel}

      <PanelErrorBoundary title="The sample flow could not be shown">
        <SampleFlow stats={s} />
      </PanelErrorBoundary>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card title="How far respondents got" className="min-w-0">
          <PanelErrorBoundary>
            <DropOffTable steps={s.dropOff} starts={s.counts.starts} />
          </PanelErrorBoundary>
        </Card>
        <div className="min-w-0 space-y-6">
          {s.quotas.length > 0 && (
            <Card title="Quotas">
              <QuotaProgressList quotas={s.quotas} />
            </Card>
          )}
          <Card title="Completes per block and version">
            <CompletesBreakdown stats={s} />
          </Card>
          <Card title="Per day">
            <PanelErrorBoundary>
              <DailyChart daily={s.daily} />
            </PanelErrorBoundary>
          </Card>
        </div>
      </div>

      {s.status !== 'draft' && lifecyclePanel}

      <Card title="Invitations by e-mail">
        <div className="space-y-6">
          <InvitationSummary invitations={s.invitations} />
          {can('fieldwork:manage') ? (
            <>
              <Alert tone="info">
                Invite only people who agreed to be contacted for research, and keep the list as
                your ethics approval and data-protection law require. Every e-mail carries a link to
                unsubscribe, which is honoured by all later sends.
              </Alert>
              <div className="grid gap-6 lg:grid-cols-2">
                <section aria-labelledby="upload-heading" className="min-w-0 space-y-2">
                  <h3 id="upload-heading" className="text-sm font-semibold text-ink">
                    Add people
                  </h3>
                  <InviteeUpload
                    teamId={teamId}
                    studyId={studyId}
                    notInvited={s.invitations.total - s.invitations.sent}
                    onImported={refreshStats}
                  />
                </section>
                <section aria-labelledby="send-heading" className="min-w-0 space-y-2">
                  <h3 id="send-heading" className="text-sm font-semibold text-ink">
                    Send
                  </h3>
                  <SendPanel
                    teamId={teamId}
                    studyId={studyId}
                    live={live}
                    listSize={s.invitations.total}
                    notInvited={s.invitations.total - s.invitations.sent}
                    notFinished={Math.max(
                      0,
                      s.invitations.sent - s.invitations.completed - s.invitations.unsubscribed,
                    )}
                    studyTitle={studyTitle}
                    duration={duration}
                    onSent={refreshStats}
                  />
                </section>
              </div>
            </>
          ) : null}
          {can('personal:read') && s.invitations.total > 0 && (
            <section aria-labelledby="list-heading" className="min-w-0 space-y-2">
              <h3 id="list-heading" className="text-sm font-semibold text-ink">
                The list
              </h3>
              <InviteeTable teamId={teamId} studyId={studyId} canManage={can('fieldwork:manage')} />
            </section>
          )}
        </div>
      </Card>
    </div>
  );
}
