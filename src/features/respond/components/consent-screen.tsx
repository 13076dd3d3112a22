import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import type { RespondentScreen } from '@shared/schemas/respondent';
import { NextBar, Paragraphs, ScreenFrame } from './screen-frame';
import { useInterfaceText } from '@/lib/interface-texts';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'consent' }>;
  onAnswer: (agreed: true) => void;
};

/** Welcome and consent: nothing is recorded about the tasks before the respondent agrees. */
export function ConsentScreen({ screen, onAnswer }: Props) {
  const [agreed, setAgreed] = useState(false);
  const t = useInterfaceText();
  const id = useId();
  return (
    <ScreenFrame title={screen.title}>
      <Paragraphs text={screen.body} />
      <label
        htmlFor={id}
        className="mt-6 flex cursor-pointer items-start gap-3 rounded-lg border-2 border-line bg-white p-4 has-[:checked]:border-primary"
      >
        <input
          id={id}
          type="checkbox"
          checked={agreed}
          onChange={(e) => setAgreed(e.target.checked)}
          className="mt-0.5 size-6 shrink-0 accent-[var(--color-primary)]"
        />
        <span className="text-base font-medium text-ink">{screen.agreeLabel}</span>
      </label>
      <p className="mt-3 text-sm text-ink-muted">{t('ui.decline_note')}</p>
      <NextBar>
        <Button
          size="lg"
          className="w-full sm:w-auto"
          disabled={!agreed}
          onClick={() => onAnswer(true)}
        >
          {t('ui.start')}
        </Button>
      </NextBar>
    </ScreenFrame>
  );
}
