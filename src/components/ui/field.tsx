import {
  forwardRef,
  useId,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
} from 'react';
import { cn } from '@/lib/cn';

const control =
  'block w-full rounded-md border border-line bg-white px-3 py-2 text-sm text-ink placeholder:text-ink-muted focus:border-primary focus:outline-none focus:ring-2 focus:ring-primary/20 aria-[invalid=true]:border-danger';

type FieldShellProps = {
  id: string;
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  children: ReactNode;
  className?: string;
};

/** Label, control, hint and error, wired together for screen readers. */
export function FieldShell({ id, label, error, hint, children, className }: FieldShellProps) {
  return (
    <div className={cn('space-y-1', className)}>
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-ink-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs font-medium text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

type Common = { label: ReactNode; error?: string; hint?: ReactNode; wrapperClassName?: string };

/** The control's id (the caller's or a generated one) and the ARIA links to its error or hint. */
function useControlProps(id: string | undefined, error?: string, hint?: ReactNode) {
  const auto = useId();
  const fid = id ?? auto;
  return {
    id: fid,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${fid}-error` : hint ? `${fid}-hint` : undefined,
  } as const;
}

export const TextField = forwardRef<
  HTMLInputElement,
  InputHTMLAttributes<HTMLInputElement> & Common
>(function TextField({ label, error, hint, wrapperClassName, className, id, ...rest }, ref) {
  const a11y = useControlProps(id, error, hint);
  return (
    <FieldShell id={a11y.id} label={label} error={error} hint={hint} className={wrapperClassName}>
      <input ref={ref} {...a11y} className={cn(control, 'h-10', className)} {...rest} />
    </FieldShell>
  );
});

export const SelectField = forwardRef<
  HTMLSelectElement,
  SelectHTMLAttributes<HTMLSelectElement> & Common
>(function SelectField(
  { label, error, hint, wrapperClassName, className, id, children, ...rest },
  ref,
) {
  const a11y = useControlProps(id, error, hint);
  return (
    <FieldShell id={a11y.id} label={label} error={error} hint={hint} className={wrapperClassName}>
      <select ref={ref} {...a11y} className={cn(control, 'h-10', className)} {...rest}>
        {children}
      </select>
    </FieldShell>
  );
});

export const TextAreaField = forwardRef<
  HTMLTextAreaElement,
  TextareaHTMLAttributes<HTMLTextAreaElement> & Common
>(function TextAreaField({ label, error, hint, wrapperClassName, className, id, ...rest }, ref) {
  const a11y = useControlProps(id, error, hint);
  return (
    <FieldShell id={a11y.id} label={label} error={error} hint={hint} className={wrapperClassName}>
      <textarea ref={ref} {...a11y} className={cn(control, 'min-h-24', className)} {...rest} />
    </FieldShell>
  );
});
