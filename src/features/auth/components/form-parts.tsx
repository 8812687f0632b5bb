import { AlertOctagon } from 'lucide-react';
import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';
import type { FieldErrors, FieldValues } from 'react-hook-form';

export interface SummaryItem {
  id: string;
  message: string;
}

/** The field errors in the order the fields appear, each pointing at its field's id. */
export function summaryItems<T extends FieldValues>(errors: FieldErrors<T>, fields: ReadonlyArray<{ name: string; id: string; label: string }>): SummaryItem[] {
  const items: SummaryItem[] = [];
  for (const f of fields) {
    const message = (errors as Record<string, { message?: unknown } | undefined>)[f.name]?.message;
    if (typeof message === 'string') items.push({ id: f.id, message: `${f.label}: ${message}` });
  }
  return items;
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

const controlClass = (invalid: boolean) =>
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

const describedBy = (id: string, hint: unknown, error: unknown) => [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & { id: string; label: string; hint?: ReactNode; error?: string; optional?: boolean };

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ id, label, hint, error, optional, className = '', ...input }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional}>
      <input ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={`${controlClass(Boolean(error))} ${className}`} {...input} />
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
