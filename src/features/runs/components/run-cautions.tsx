import { ScreenCaution } from '@/components/ui/screen-caution';
import { runCautions } from '@shared/schemas/exports';

/** The one caution of a screen where estimates are read. */
export function RunCautions({ screen }: { screen: 'models' | 'run' }) {
  return (
    <ScreenCaution
      screen={screen}
      summary="Estimates from stated, hypothetical choices, with sampling and simulation error."
    >
      <ul className="list-disc space-y-1 pl-5">
        {runCautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </ScreenCaution>
  );
}
