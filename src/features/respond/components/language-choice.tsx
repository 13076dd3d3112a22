import { useState } from 'react';
import { cn } from '@/lib/cn';
import type { SurveyLanguage } from '@shared/schemas/respondent';

/**
 * The first screen's choice of language, for studies in several: each language named in
 * itself, a large tap target each. Shown until the first answer (then the language stays).
 */
export function LanguageChoice({
  languages,
  current,
  label,
  onChoose,
}: {
  languages: SurveyLanguage[];
  current: string;
  label: string;
  onChoose: (tag: string) => Promise<void>;
}) {
  const [busy, setBusy] = useState<string | null>(null);
  return (
    <div role="group" aria-label={label} className="mx-auto mb-6 w-full max-w-2xl">
      <p className="mb-2 text-sm font-medium text-ink-muted">{label}</p>
      <div className="flex flex-wrap gap-2">
        {languages.map((l) => (
          <button
            key={l.tag}
            type="button"
            lang={l.tag}
            dir={l.dir}
            aria-pressed={l.tag === current}
            disabled={busy !== null}
            onClick={() => {
              if (l.tag === current) return;
              setBusy(l.tag);
              void onChoose(l.tag).finally(() => setBusy(null));
            }}
            className={cn(
              'min-h-11 rounded-full border-2 px-4 text-base font-medium focus-visible:outline focus-visible:outline-3 focus-visible:outline-accent',
              l.tag === current
                ? 'border-primary bg-primary-soft text-primary-strong'
                : 'border-line bg-white text-ink hover:border-primary',
            )}
          >
            {l.name}
          </button>
        ))}
      </div>
    </div>
  );
}
