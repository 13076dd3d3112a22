import { cn } from '@/lib/cn';
import type { TaskLayoutProps } from './alternative-view';

/** The task's radio group: its name, the choice made, and (for designed alternatives) summaries. */
type RadioGroup = Pick<TaskLayoutProps, 'name' | 'selected' | 'onChoose'> &
  Partial<Pick<TaskLayoutProps, 'summaryId'>>;

/**
 * The radio of one alternative, the same in every layout of a task and for the opt-out. Without
 * onChoose (preview, a respondent's answers) it is disabled.
 */
export function ChoiceRadio({
  group,
  position,
  large = false,
}: {
  group: RadioGroup;
  position: number;
  /** The larger radio of a stacked card, where the whole card is the tap target. */
  large?: boolean;
}) {
  const { name, selected, onChoose, summaryId } = group;
  return (
    <input
      type="radio"
      name={name}
      value={position}
      checked={selected === position}
      disabled={!onChoose}
      onChange={() => onChoose?.(position)}
      aria-describedby={summaryId?.(position)}
      className={cn(large ? 'size-6' : 'size-5', 'shrink-0 accent-[var(--color-primary)]')}
    />
  );
}
