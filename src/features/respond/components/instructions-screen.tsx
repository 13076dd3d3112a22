import { Button } from '@/components/ui/button';
import type { RespondentScreen } from '@shared/schemas/respondent';
import { NextBar, Paragraphs, ScreenFrame } from './screen-frame';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'instructions' }>;
  onContinue: () => void;
};

export function InstructionsScreen({ screen, onContinue }: Props) {
  return (
    <ScreenFrame title={screen.title}>
      <Paragraphs text={screen.body} />
      <NextBar>
        <Button size="lg" className="w-full sm:w-auto" onClick={onContinue}>
          Continue
        </Button>
      </NextBar>
    </ScreenFrame>
  );
}
