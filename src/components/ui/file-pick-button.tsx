import type { ReactNode } from 'react';

/**
 * A button that opens the file chooser: a label holding a visually hidden file input, so the
 * button is reached by keyboard and read out by its text (or `inputLabel`). It reports the first
 * picked file and then clears the input, so that picking the same file again after a refusal is
 * reported again.
 */
export function FilePickButton({
  children,
  accept,
  onFile,
  className,
  disabled,
  inputLabel,
}: {
  children: ReactNode;
  /** The file types the chooser offers (the input's `accept`). */
  accept: string;
  onFile: (file: File | undefined) => void;
  /** The button's look; add `has-[:disabled]:` styles where it can be disabled. */
  className: string;
  disabled?: boolean;
  /** The input's accessible name where the button text alone is not enough. */
  inputLabel?: string;
}) {
  return (
    <label className={className}>
      {children}
      <input
        aria-label={inputLabel}
        type="file"
        accept={accept}
        className="sr-only"
        disabled={disabled}
        onChange={(e) => {
          onFile(e.target.files?.[0]);
          e.target.value = '';
        }}
      />
    </label>
  );
}
