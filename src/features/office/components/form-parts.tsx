import { AlertOctagon } from 'lucide-react';
import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

export interface SummaryItem {
  id: string;
  message: string;
}

/** Shown on a failed submit: what went wrong, each with a link that moves focus to the field. */
export const ErrorSummary = forwardRef<HTMLDivElement, { title?: string; items: SummaryItem[]; formError?: ReactNode }>(function ErrorSummary(
  { title = 'Please check the form', items, formError },
  ref,
) {
  const titleId = useId();
  if (items.length === 0 && !formError) return null;
  return (
    <div ref={ref} tabIndex={-1} role="alert" aria-labelledby={titleId} className="flex gap-3 rounded-md border-2 border-oxide bg-oxide-tint p-4 focus:outline-3">
      <AlertOctagon aria-hidden className="mt-0.5 size-5 shrink-0 text-oxide" />
      <div>
        <p id={titleId} className="font-semibold text-oxide">
          {formError && items.length === 0 ? 'That did not work' : title}
        </p>
        {formError && <div className="text-ink">{formError}</div>}
        {items.length > 0 && (
          <ul className="mt-1 list-disc pl-5">
            {items.map((item) => (
              <li key={item.id}>
                <a
                  href={`#${item.id}`}
                  className="font-semibold text-oxide underline underline-offset-2"
                  onClick={(e) => {
                    e.preventDefault();
                    document.getElementById(item.id)?.focus();
                  }}
                >
                  {item.message}
                </a>
              </li>
            ))}
          </ul>
        )}
      </div>
    </div>
  );
});

export const controlClass = (invalid: boolean) =>
  `min-h-11 w-full rounded-md border bg-white px-3 text-ink focus:border-temper ${invalid ? 'border-2 border-oxide' : 'border-cast-line'}`;

interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  children: ReactNode;
}

/** Label above, hint under, the field's own message last (with an icon, not colour alone). */
export function FieldShell({ id, label, hint, error, optional, children }: FieldShellProps) {
  return (
    <div className="grid content-start gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
        {optional && <span className="font-normal text-cast"> (optional)</span>}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-cast">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-semibold text-oxide">
          <AlertOctagon aria-hidden className="size-4 shrink-0" />
          {error}
        </p>
      )}
    </div>
  );
}

export const describedBy = (id: string, hint: unknown, error: unknown) => [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  /** A unit shown after the value, e.g. "mm" or "$" as a prefix. */
  suffix?: string;
  prefix?: string;
};

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ id, label, hint, error, optional, suffix, prefix, className = '', ...input }, ref) {
  const control = (
    <input ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={`${controlClass(Boolean(error))} ${className}`} {...input} />
  );
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional}>
      {suffix || prefix ? (
        <span className="flex items-center gap-2">
          {prefix && <span className="text-cast" aria-hidden>{prefix}</span>}
          {control}
          {suffix && <span className="shrink-0 text-cast">{suffix}</span>}
        </span>
      ) : (
        control
      )}
    </FieldShell>
  );
});

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & { id: string; label: string; hint?: ReactNode; error?: string; optional?: boolean; children: ReactNode };

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField({ id, label, hint, error, optional, children, ...select }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional}>
      <select ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={controlClass(Boolean(error))} {...select}>
        {children}
      </select>
    </FieldShell>
  );
});

type TextAreaFieldProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & { id: string; label: string; hint?: ReactNode; error?: string; optional?: boolean };

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField({ id, label, hint, error, optional, ...area }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional}>
      <textarea ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={`${controlClass(Boolean(error))} py-2`} {...area} />
    </FieldShell>
  );
});
