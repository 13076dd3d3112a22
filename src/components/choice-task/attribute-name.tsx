import { useId, useState } from 'react';
import type { Attribute } from '@shared/schemas/study-definition';
import { useInterfaceText } from '@/lib/interface-texts';

/**
 * An attribute's name with its help in place: a small "What is this?" toggle opens the
 * description right under the name, where the respondent is looking.
 */
export function AttributeName({ attribute }: { attribute: Attribute }) {
  const [open, setOpen] = useState(false);
  const t = useInterfaceText();
  const id = useId();
  const help = attribute.description?.trim();
  return (
    <div>
      <span className="font-medium text-ink">{attribute.name}</span>
      {help && (
        <>
          {' '}
          <button
            type="button"
            aria-expanded={open}
            aria-controls={id}
            onClick={() => setOpen((o) => !o)}
            className="ms-1 inline-flex min-h-6 items-center rounded px-1 text-xs font-medium text-primary underline decoration-dotted underline-offset-2"
          >
            {open ? t('ui.hide') : t('ui.what_is_this')}
            <span className="sr-only"> ({attribute.name})</span>
          </button>
          <p id={id} hidden={!open} className="mt-1 text-sm font-normal text-ink-soft">
            {help}
          </p>
        </>
      )}
    </div>
  );
}
