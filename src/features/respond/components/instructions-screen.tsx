import { Button } from '@/components/ui/button';
import type { RespondentScreen } from '@shared/schemas/respondent';
import { NextBar, Paragraphs, ScreenFrame } from './screen-frame';
import { useInterfaceText } from '@/lib/interface-texts';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'instructions' }>;
  onContinue: () => void;
};

export function InstructionsScreen({ screen, onContinue }: Props) {
  const t = useInterfaceText();
  return (
    <ScreenFrame title={screen.title}>
      <Paragraphs text={screen.body} />
      <NextBar>
        <Button size="lg" className="w-full sm:w-auto" onClick={onContinue}>
          {t('ui.continue')}
        </Button>
      </NextBar>
    </ScreenFrame>
  );
}
