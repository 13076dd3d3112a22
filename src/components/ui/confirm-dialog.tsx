/**
 * The app's own confirmation dialog, in place of the browser's `confirm`: a modal `<dialog>`
 * (focus moves into it and stays there, Escape cancels, the page behind is inert) with a title,
 * the consequence in words, and two buttons named for what they do. Cancel has the focus first,
 * so a stray Enter never triggers an irreversible action.
 */
import { useCallback, useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Button } from './button';

export type ConfirmRequest = {
  title: string;
  body?: ReactNode;
  /** Label of the confirming button ("Go live", "Remove"). */
  confirmLabel: string;
  /** Irreversible or disruptive actions show a red confirming button. */
  danger?: boolean;
};

type Props = ConfirmRequest & { onClose: (confirmed: boolean) => void };

export function ConfirmDialog({ title, body, confirmLabel, danger, onClose }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    // jsdom and very old browsers lack showModal(): an open dialog still works there.
    if (typeof dialog.showModal === 'function' && !dialog.open) dialog.showModal();
    else dialog.setAttribute('open', '');
    return () => {
      if (typeof dialog.close === 'function' && dialog.open) dialog.close();
    };
  }, []);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={body ? bodyId : undefined}
      onCancel={(e) => {
        e.preventDefault();
        onClose(false);
      }}
      className="m-auto w-[calc(100%-2rem)] max-w-md rounded-lg border border-line bg-white p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <div className="space-y-3 p-5">
        <h2 id={titleId} className="text-base font-semibold text-ink">
          {title}
        </h2>
        {body && (
          <div id={bodyId} className="text-sm text-ink-soft">
            {body}
          </div>
        )}
        <div className="flex flex-wrap justify-end gap-2 pt-2">
          <Button variant="secondary" autoFocus onClick={() => onClose(false)}>
            Cancel
          </Button>
          <Button variant={danger ? 'danger' : 'primary'} onClick={() => onClose(true)}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}

/**
 * `const { confirm, dialog } = useConfirm()`: render `dialog` once, then
 * `if (await confirm({ title, body, confirmLabel })) …`.
 */
export function useConfirm() {
  const [request, setRequest] = useState<
    (ConfirmRequest & { resolve: (ok: boolean) => void }) | null
  >(null);
  const confirm = useCallback(
    (r: ConfirmRequest) => new Promise<boolean>((resolve) => setRequest({ ...r, resolve })),
    [],
  );
  const dialog = request ? (
    <ConfirmDialog
      {...request}
      onClose={(ok) => {
        request.resolve(ok);
        setRequest(null);
      }}
    />
  ) : null;
  return { confirm, dialog };
}
