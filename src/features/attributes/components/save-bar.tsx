import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';

type Props = {
  dirty: boolean;
  saving: boolean;
  errorCount: number;
  message?: string | null;
  onSave: () => void;
  onDiscard: () => void;
};

/** Sticky bar at the bottom: whether everything is saved, and the save action. */
export function SaveBar({ dirty, saving, errorCount, message, onSave, onDiscard }: Props) {
  const state = saving
    ? 'Saving…'
    : errorCount > 0
      ? `${errorCount} problem${errorCount === 1 ? '' : 's'} to fix before saving`
      : dirty
        ? 'Unsaved changes'
        : 'All changes saved';
  return (
    <div className="sticky bottom-0 z-20 -mx-4 mt-6 border-t border-line bg-white/95 px-4 py-3 backdrop-blur sm:mx-0 sm:rounded-lg sm:border">
      <div className="flex flex-wrap items-center gap-3">
        <p
          role="status"
          className={cn(
            'flex-1 text-sm font-medium',
            errorCount > 0 ? 'text-danger' : dirty ? 'text-ink' : 'text-success',
          )}
        >
          <span
            aria-hidden
            className={cn(
              'mr-2 inline-block size-2 rounded-full',
              errorCount > 0 ? 'bg-danger' : dirty ? 'bg-accent' : 'bg-success',
            )}
          />
          {state}
          {message && <span className="ml-2 font-normal text-ink-soft">{message}</span>}
        </p>
        <Button variant="ghost" onClick={onDiscard} disabled={!dirty || saving}>
          Discard
        </Button>
        <Button onClick={onSave} disabled={!dirty} busy={saving}>
          Save changes
        </Button>
      </div>
    </div>
  );
}
