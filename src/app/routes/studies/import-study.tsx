/**
 * Studies → Import choice data: choose the long-format choice file (and, optionally, the
 * background answers), read the preview with every problem by line and column, edit the
 * attributes inferred from the columns, then create the study. Nothing is saved while the
 * files have problems.
 */
import { useId, useState } from 'react';
import { useNavigate } from 'react-router';
import type { ImportPreview, ImportSetupInput } from '@shared/schemas/study-import';
import { Card, PageHeader } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { usePreviewStudyImport } from '@/features/study-import/api/preview-study-import';
import { useSaveStudyImport } from '@/features/study-import/api/save-study-import';
import { ImportSummary } from '@/features/study-import/components/import-summary';
import { ImportSetupForm } from '@/features/study-import/components/import-setup-form';
import { ImportFormatHelp } from '@/features/study-import/components/import-format-help';
import { BackLink } from '@/components/ui/back-link';

const fileInput =
  'block w-full text-sm text-ink-soft file:mr-3 file:h-9 file:rounded-md file:border file:border-line file:bg-white file:px-3 file:text-sm file:font-medium file:text-ink hover:file:border-primary';

/** A labelled input for one CSV file; `onPick` gets the chosen file, or null when cleared. */
function CsvFilePicker({ label, onPick }: { label: string; onPick: (file: File | null) => void }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
      </label>
      <input
        id={id}
        type="file"
        accept=".csv,text/csv,text/plain"
        className={fileInput}
        onChange={(e) => onPick(e.target.files?.[0] ?? null)}
      />
    </div>
  );
}

export function Component() {
  const { teamId, can } = useCurrentTeam();
  const navigate = useNavigate();
  const [choices, setChoices] = useState<File | null>(null);
  const [background, setBackground] = useState<File | null>(null);
  const [round, setRound] = useState(0);
  // The latest preview stays on screen (and the set-up form mounted) while a new check runs.
  const [latest, setLatest] = useState<ImportPreview | null>(null);
  const preview = usePreviewStudyImport(teamId);
  const save = useSaveStudyImport(teamId);
  const files = choices ? { choices, background } : null;
  // A new file makes the last preview stale.
  const pickFile = (set: (file: File | null) => void) => (file: File | null) => {
    set(file);
    setLatest(null);
    preview.reset();
  };

  const check = (setup?: ImportSetupInput) => {
    if (!files) return;
    save.reset();
    preview.mutate(
      { files, setup },
      {
        onSuccess: (data) => {
          setLatest(data);
          if (!setup) setRound((r) => r + 1);
        },
      },
    );
  };
  const create = (setup: ImportSetupInput) => {
    if (!files) return;
    save.mutate(
      { files, setup },
      {
        onSuccess: (r) => void navigate(paths.studySection.getHref(teamId, r.studyId, 'models')),
      },
    );
  };
  const saveProblems = save.error instanceof ApiError ? save.error.fields : [];

  if (!can('study:write'))
    return <ErrorText error={new Error('Only owners and editors can create studies.')} />;
  return (
    <div className="space-y-6">
      <BackLink to={paths.studies.getHref(teamId)}>Studies</BackLink>
      <PageHeader
        title="Import choice data"
        description="Create a study from choices collected elsewhere, then estimate, read tastes, simulate shares and export as for any study."
      />
      <Card title="1. Files" className="max-w-3xl">
        <div className="space-y-4">
          <CsvFilePicker
            label="Choice file (CSV, one row per alternative)"
            onPick={pickFile(setChoices)}
          />
          <CsvFilePicker
            label="Background answers (optional CSV, one row per respondent)"
            onPick={pickFile(setBackground)}
          />
          <ImportFormatHelp />
          <Button disabled={!choices} busy={preview.isPending} onClick={() => check()}>
            Check the files
          </Button>
          {preview.isPending && <p className="text-sm text-ink-muted">Reading the files…</p>}
          <ErrorText error={preview.error} />
          {latest && <ImportSummary preview={latest} />}
        </div>
      </Card>
      {latest && latest.attributes.length > 0 && (
        <Card title="2. Attributes and levels" className="max-w-5xl">
          <ImportSetupForm
            key={round}
            attributes={latest.attributes}
            defaultName={choices?.name.replace(/\.[^.]+$/, '') ?? ''}
            canSave={latest.problemCount === 0}
            busy={preview.isPending || save.isPending}
            onCheck={(setup) => check(setup)}
            onSave={create}
          />
          <div className="mt-4 space-y-2">
            <ErrorText error={save.error} />
            {saveProblems.length > 0 && (
              <ul className="list-disc pl-5 text-sm text-danger">
                {saveProblems.map((f, i) => (
                  <li key={i}>
                    <span className="font-mono text-xs">{f.path}</span>: {f.message}
                  </li>
                ))}
              </ul>
            )}
          </div>
        </Card>
      )}
    </div>
  );
}
