/**
 * A translation made from a source wording that has changed since: the flag, the wording it
 * was made from, and (for editors) "Still right" to confirm it without rewriting it.
 */
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';

export function StaleNote({
  previous,
  where,
  canConfirm,
  busy,
  onConfirm,
}: {
  previous: string;
  where: string;
  canConfirm: boolean;
  busy: boolean;
  onConfirm: () => void;
}) {
  return (
    <div className="mt-2 space-y-1 rounded-md border border-accent/50 bg-accent-soft px-3 py-2">
      <div className="flex flex-wrap items-center gap-2">
        <Badge tone="accent">Source changed</Badge>
        {canConfirm && (
          <Button size="sm" variant="secondary" busy={busy} onClick={onConfirm}>
            Still right<span className="sr-only">: {where}</span>
          </Button>
        )}
      </div>
      <p className="break-words text-xs text-ink-soft">
        Translated from:{' '}
        <span className="whitespace-pre-line text-ink">{previous || '(empty)'}</span>
      </p>
    </div>
  );
}
