import { AlertOctagon } from 'lucide-react';
import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import type { FieldErrors, FieldValues } from 'react-hook-form';

export interface SummaryItem {
  id: string;
  message: string;
}

/** Field errors in the order the fields appear, each pointing at its field. */
export function summaryItems<T extends FieldValues>(errors: FieldErrors<T>, fields: ReadonlyArray<{ name: string; id: string; label: string }>): SummaryItem[] {
  const items: SummaryItem[] = [];
  for (const f of fields) {
    const message = (errors as Record<string, { message?: unknown } | undefined>)[f.name]?.message;
    if (typeof message === 'string') items.push({ id: f.id, message: `${f.label}: ${message}` });
  }
  return items;
}

/** Shown on a failed submit: what went wrong, each with a link that moves focus to its field. */
export const ErrorSummary = forwardRef<HTMLDivElement, { title?: string; items: SummaryItem[]; formError?: ReactNode }>(function ErrorSummary(
  { title = 'Please check the form', items, formError },
  ref,
) {
  const titleId = useId();
  if (items.length === 0 && !formError) return null;
  return (
    <div ref={ref} tabIndex={-1} role="alert" aria-labelledby={titleId} className="flex gap-3 rounded-md border-2 border-oxide bg-oxide-tint p-4">
      <AlertOctagon aria-hidden className="mt-0.5 size-6 shrink-0 text-oxide" />
      <div>
        <p id={titleId} className="text-lg font-semibold text-oxide">
          {formError && items.length === 0 ? 'That was refused' : title}
        </p>
        {formError && <div className="text-lg text-ink">{formError}</div>}
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

// Floor controls are 48 px high: gloves, handhelds and a scanner in the other hand.
const controlClass = (invalid: boolean) =>
  `min-h-12 w-full rounded-md border bg-white px-3 text-lg text-ink focus:border-temper ${invalid ? 'border-2 border-oxide' : 'border-cast-line'}`;

interface ShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  suffix?: string;
  children: ReactNode;
}

/** Label above, hint under, the field's own message last (with an icon, not colour alone). */
export function FieldShell({ id, label, hint, error, optional, children }: ShellProps) {
  return (
    <div className="grid content-start gap-1">
      <label htmlFor={id} className="text-lg font-semibold">
        {label}
        {optional && <span className="font-normal text-cast"> (optional)</span>}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className="text-cast">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="flex items-center gap-1 font-semibold text-oxide">
          <AlertOctagon aria-hidden className="size-4 shrink-0" />
          {error}
        </p>
      )}
    </div>
  );
}

export const describedBy = (id: string, hint: unknown, error: unknown) => [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & { id: string; label: string; hint?: ReactNode; error?: string; optional?: boolean; suffix?: string };

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ id, label, hint, error, optional, suffix, className = '', ...input }, ref) {
  const control = (
    <input ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={`${controlClass(Boolean(error))} ${className}`} {...input} />
  );
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional}>
      {suffix ? (
        <div className="flex items-stretch">
          <div className="min-w-0 flex-1 [&>input]:rounded-r-none">{control}</div>
          <span aria-hidden className="inline-flex items-center rounded-r-md border border-l-0 border-cast-line bg-panel px-3 font-semibold text-cast">
            {suffix}
          </span>
        </div>
      ) : (
        control
      )}
    </FieldShell>
  );
});

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & { id: string; label: string; hint?: ReactNode; error?: string; children: ReactNode };

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField({ id, label, hint, error, children, ...select }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
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
      <textarea ref={ref} id={id} rows={3} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={`${controlClass(Boolean(error))} py-2`} {...area} />
    </FieldShell>
  );
});
