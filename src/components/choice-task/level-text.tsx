import type { AlternativeCell } from './alternative-view';
import { useInterfaceText } from '@/lib/interface-texts';

/** One level as shown in a task: its image (if any) and text, or a dash where it does not apply. */
export function LevelText({ cell }: { cell: AlternativeCell }) {
  const t = useInterfaceText();
  if (cell.text === null)
    return (
      <span>
        <span aria-hidden>—</span>
        <span className="sr-only">{t('ui.not_applicable')}</span>
      </span>
    );
  return (
    <>
      {cell.image && (
        <img src={cell.image} alt="" className="mb-1 max-h-20 w-auto max-w-full rounded" />
      )}
      <span className="break-words">{cell.text}</span>
    </>
  );
}
