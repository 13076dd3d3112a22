import { useState } from 'react';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { useStudyTexts } from '../api/get-study-texts';
import { LanguagesCard } from './languages-card';
import { TranslationFilesCard } from './translation-files-card';
import { TranslationTable } from './translation-table';

/** The Languages view of the Questionnaire section: the list, then one language's texts. */
export function LanguagesPanel({
  teamId,
  studyId,
  canEdit,
}: {
  teamId: string;
  studyId: string;
  canEdit: boolean;
}) {
  const texts = useStudyTexts(teamId, studyId);
  const [chosen, setChosen] = useState<string | null>(null);
  if (texts.isPending) return <Spinner label="Loading the study’s texts…" />;
  if (texts.error) return <ErrorText error={texts.error} />;
  const view = texts.data;
  // By default the first translation (what there is to do), else the source language.
  const lang =
    chosen && view.languages.includes(chosen) ? chosen : (view.languages[1] ?? view.languages[0]);
  const common = { teamId, studyId, view, canEdit };
  return (
    <div className="space-y-6">
      <LanguagesCard {...common} selected={lang} onSelect={setChosen} />
      {lang !== view.languages[0] && (
        <TranslationFilesCard
          key={lang}
          teamId={teamId}
          studyId={studyId}
          lang={lang}
          canImport={canEdit && view.editable}
        />
      )}
      <TranslationTable key={lang} {...common} lang={lang} />
    </div>
  );
}
