/**
 * Exports section: per-respondent estimates (CSV, XLSX), the long-format choice data, the
 * design, the background answers and a printable run report. Every role may download; the
 * files leave personal columns out unless the role reads personal data.
 */
import { useParams, useSearchParams } from 'react-router';
import { Alert, Card, Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { useTastesRuns } from '@/features/tastes/api/list-tastes-runs';
import { RunPicker } from '@/features/tastes/components/run-picker';
import { exportsPath, useExportManifest } from '@/features/exports/api/get-export-manifest';
import { DownloadList, type DownloadItem } from '@/features/exports/components/download-list';

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const manifest = useExportManifest(teamId, studyId);
  const runs = useTastesRuns(teamId, studyId);
  if (manifest.isPending || runs.isPending) return <Spinner label="Loading downloads…" />;
  if (manifest.error || runs.error) return <ErrorText error={manifest.error ?? runs.error} />;

  const base = exportsPath(teamId, studyId);
  const runId = search.get('run') ?? runs.data[0]?.id ?? '';
  const run = runs.data.find((r) => r.id === runId);
  const q = `?runId=${encodeURIComponent(runId)}`;
  const noRun = run ? undefined : 'Needs a finished run (start one in Models).';
  const noProfiles =
    noRun ?? (run && run.profiles === 0 ? 'This run has no taste profiles (MNL).' : undefined);
  const personal = manifest.data.personalColumns;
  const notLive = manifest.data.choicesAvailable ? undefined : 'The study has not been live yet.';

  const runItems: DownloadItem[] = [
    {
      key: 'estimates',
      title: 'Estimates, WTP and fit',
      description:
        'The parameter, WTP and fit tables as on the Estimates screen, with readable names, units and 95 % intervals. The XLSX sets number formats and has a codebook sheet; each CSV is one table, and the codebook CSV explains every column.',
      links: [
        { label: 'XLSX', href: `${base}/estimates.xlsx${q}` },
        { label: 'Estimates CSV', href: `${base}/estimates.csv${q}&table=estimates` },
        {
          label: 'WTP CSV',
          href: `${base}/estimates.csv${q}&table=wtp`,
          disabledReason: run?.wtpUnavailable,
        },
        { label: 'Fit CSV', href: `${base}/estimates.csv${q}&table=fit` },
        { label: 'Codebook CSV', href: `${base}/estimates.csv${q}&table=codebook` },
      ],
      disabledReason: noRun,
    },
    {
      key: 'profiles',
      title: 'Taste profiles',
      description:
        'One row per respondent: each conditional mean with its SD, WTP, effective draws, quality flags and background answers. The XLSX starts with a sheet on the model, the data and the cautions.',
      links: [
        { label: 'CSV', href: `${base}/taste-profiles.csv${q}` },
        { label: 'XLSX', href: `${base}/taste-profiles.xlsx${q}` },
      ],
      disabledReason: noProfiles,
    },
    {
      key: 'estimation-data',
      title: 'Estimation data of this run',
      description:
        'Exactly the rows and columns this run was fitted to (included respondents only). Its SHA-256 is the data hash in the run report.',
      links: [{ label: 'CSV', href: `${base}/choices.csv${q}` }],
      disabledReason: noRun,
    },
    {
      key: 'covariance',
      title: 'Covariance of the estimates',
      description:
        'The full covariance matrix of the parameter estimates, robust (clustered by respondent) or classical, for your own tests and simulations.',
      links: [
        { label: 'Robust CSV', href: `${base}/covariance.csv${q}&kind=robust` },
        { label: 'Classical CSV', href: `${base}/covariance.csv${q}&kind=classical` },
      ],
      disabledReason: noRun,
    },
    {
      key: 'report',
      title: 'Run report',
      description: 'Parameters, fit, WTP, population distributions and cautions, ready to print.',
      links: [{ label: 'Open report', href: `${base}/run-report.html${q}`, newTab: true }],
      disabledReason: noRun,
    },
  ];
  const studyItems: DownloadItem[] = [
    {
      key: 'choices',
      title: 'Choice data (long format)',
      description:
        'One row per alternative shown, for every respondent who answered a task: included (and why not), the order the task was shown in, where each alternative stood on screen, seconds per task and the coded columns. The command-line estimator reads it and skips rows with included=false.',
      links: [{ label: 'CSV', href: `${base}/choices.csv` }],
      disabledReason: notLive,
    },
    {
      key: 'wide',
      title: 'Respondents (wide) for statistics packages',
      description:
        'One row per respondent: status, inclusion, times, each task in the order shown with the choice, its screen position and seconds, and the background answers. The R script reads it with the right types and factor levels.',
      links: [
        { label: 'CSV', href: `${base}/respondents-wide.csv` },
        { label: 'R script', href: `${base}/respondents-wide.R` },
      ],
      disabledReason: notLive,
    },
    {
      key: 'codebook',
      title: 'Codebook of the data files',
      description:
        'Every column of the long and the wide file: what it is, its unit and how it is coded.',
      links: [{ label: 'CSV', href: `${base}/codebook.csv` }],
      disabledReason: notLive,
    },
    {
      key: 'design',
      title: 'Design',
      description: 'The frozen choice tasks: one row per designed alternative with its levels.',
      links: [{ label: 'CSV', href: `${base}/design.csv` }],
      disabledReason: notLive,
    },
    {
      key: 'answers',
      title: 'Background answers',
      description: 'Every respondent with their status, inclusion, quality flags and answers.',
      links: [{ label: 'CSV', href: `${base}/background-answers.csv` }],
    },
    {
      key: 'randomisation',
      title: 'Randomisation record',
      description:
        'For every respondent: the order the tasks were shown in and which alternative stood at each position, left to right (none = the opt-out or status quo).',
      links: [{ label: 'CSV', href: `${base}/randomisation.csv` }],
      disabledReason: notLive,
    },
    {
      key: 'answer-history',
      title: 'Changed answers',
      description:
        'Every answer a respondent went back and changed, with when each was given and replaced. Estimates and the other files use the latest answer only.',
      links: [{ label: 'CSV', href: `${base}/answer-history.csv` }],
    },
  ];

  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-xl font-semibold text-ink">Exports</h2>
        <p className="text-sm text-ink-soft">Take the data and the estimates away.</p>
      </div>
      <Alert
        tone={personal ? 'warning' : 'info'}
        title={personal ? 'These files hold personal data' : 'No personal data in your downloads'}
      >
        {personal
          ? 'Your role reads personal data, so downloads include external ids and free-text answers. Store and share them as your ethics approval and data-protection law require.'
          : 'Your role does not read personal data: external ids and free-text answers are left out of every file.'}{' '}
        Text cells that a spreadsheet could run as a formula are prefixed with a single quote.
      </Alert>
      <Card
        title="Results of a run"
        actions={
          runs.data.length > 0 ? (
            <RunPicker
              runs={runs.data}
              value={runId}
              withProfiles={false}
              onChange={(id) => setSearch({ run: id }, { replace: true })}
            />
          ) : undefined
        }
      >
        <DownloadList items={runItems} />
      </Card>
      <Card title="Study data">
        <DownloadList items={studyItems} />
      </Card>
    </div>
  );
}
