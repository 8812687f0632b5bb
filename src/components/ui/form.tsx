import { AlertOctagon } from 'lucide-react';
import {
  forwardRef,
  useCallback,
  useEffect,
  useId,
  useRef,
  type InputHTMLAttributes,
  type ReactNode,
  type Ref,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
} from 'react';
import type { SummaryItem } from './error-summary';

/** `floor` is for the warehouse: 48 px controls and larger type for gloves, handhelds and a scanner in the other hand. */
export type FieldVariant = 'desk' | 'floor';

/**
 * `desk` and `floor` put the icon beside the text; `banner` (checkout) and `compact` (narrow side panels) put it in the title line.
 */
export type SummaryVariant = FieldVariant | 'banner' | 'compact';

interface SummaryLook {
  box: string;
  sideIcon?: string;
  titleIcon?: string;
  title: string;
  formError: string;
  list: string;
  link: string;
  refused: string;
}

const deskLink = 'font-semibold text-oxide underline underline-offset-2';

const summaryLooks: Record<SummaryVariant, SummaryLook> = {
  desk: {
    box: 'flex gap-3 rounded-md border-2 border-oxide bg-oxide-tint p-4 focus:outline-3',
    sideIcon: 'mt-0.5 size-5 shrink-0 text-oxide',
    title: 'font-semibold text-oxide',
    formError: 'text-ink',
    list: 'mt-1 list-disc pl-5',
    link: deskLink,
    refused: 'That did not work',
  },
  floor: {
    box: 'flex gap-3 rounded-md border-2 border-oxide bg-oxide-tint p-4',
    sideIcon: 'mt-0.5 size-6 shrink-0 text-oxide',
    title: 'text-lg font-semibold text-oxide',
    formError: 'text-lg text-ink',
    list: 'mt-1 list-disc pl-5',
    link: deskLink,
    refused: 'That was refused',
  },
  banner: {
    box: 'rounded-md border-2 border-oxide bg-oxide-tint p-4',
    titleIcon: 'size-5',
    title: 'inline-flex items-center gap-2 font-bold text-oxide',
    formError: 'text-ink',
    list: 'mt-2 list-disc pl-6',
    link: 'font-semibold text-oxide underline',
    refused: 'That did not work',
  },
  compact: {
    box: 'rounded-md border-2 border-oxide bg-oxide-tint p-3',
    titleIcon: 'size-4',
    title: 'flex items-center gap-1 font-semibold text-oxide',
    formError: '',
    list: 'list-disc pl-5',
    link: deskLink,
    refused: 'That did not work',
  },
};

function setRef<T>(ref: Ref<T> | undefined, value: T | null) {
  if (typeof ref === 'function') ref(value);
  else if (ref) ref.current = value;
}

interface ErrorSummaryProps {
  title?: string;
  items: SummaryItem[];
  formError?: ReactNode;
  variant?: SummaryVariant;
  /** When given, the summary takes focus each time this changes (one per failed submit) and there is something to show. */
  focusKey?: number;
  /** The title when only the server's message shows, in place of the variant's "That did not work". */
  refusedTitle?: string;
  /** How a link reaches its field; plain focus by default. */
  focusField?: (id: string) => void;
}

/** Shown on a failed submit: what went wrong, each with a link that moves focus to the field. */
export const ErrorSummary = forwardRef<HTMLDivElement, ErrorSummaryProps>(function ErrorSummary(
  { title = 'Please check the form', items, formError, variant = 'desk', focusKey, refusedTitle, focusField },
  ref,
) {
  const titleId = useId();
  const inner = useRef<HTMLDivElement | null>(null);
  const attach = useCallback(
    (el: HTMLDivElement | null) => {
      inner.current = el;
      setRef(ref, el);
    },
    [ref],
  );
  useEffect(() => {
    if (focusKey !== undefined && items.length > 0) inner.current?.focus();
    // Focus again on every failed submit, not only when the list changes.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focusKey]);
  if (items.length === 0 && !formError) return null;
  const look = summaryLooks[variant];
  return (
    <div
      ref={attach}
      tabIndex={-1}
      role="alert"
      aria-labelledby={titleId}
      className={look.box}
    >
      {look.sideIcon && <AlertOctagon aria-hidden className={look.sideIcon} />}
      <div>
        <p id={titleId} className={look.title}>
          {look.titleIcon && <AlertOctagon aria-hidden className={look.titleIcon} />}
          {formError && items.length === 0 ? (refusedTitle ?? look.refused) : title}
        </p>
        {formError && <div className={look.formError || undefined}>{formError}</div>}
        {items.length > 0 && (
          <ul className={look.list}>
            {items.map((item) => (
              <li key={item.id}>
                <a
                  href={`#${item.id}`}
                  className={look.link}
                  onClick={(e) => {
                    e.preventDefault();
                    if (focusField) focusField(item.id);
                    else document.getElementById(item.id)?.focus();
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

export const controlClass = (invalid: boolean, variant: FieldVariant = 'desk') =>
  variant === 'floor'
    ? `min-h-12 w-full rounded-md border bg-white px-3 text-lg text-ink focus:border-temper ${invalid ? 'border-2 border-oxide' : 'border-cast-line'}`
    : `min-h-11 w-full rounded-md border bg-white px-3 text-ink focus:border-temper ${invalid ? 'border-2 border-oxide' : 'border-cast-line'}`;

export const describedBy = (id: string, hint: unknown, error: unknown) => [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  variant?: FieldVariant;
  children: ReactNode;
}

/** Label above, hint under, the field's own message last (with an icon, not colour alone). */
export function FieldShell({ id, label, hint, error, optional, variant = 'desk', children }: FieldShellProps) {
  const floor = variant === 'floor';
  return (
    <div className="grid content-start gap-1">
      <label htmlFor={id} className={floor ? 'text-lg font-semibold' : 'font-semibold'}>
        {label}
        {optional && <span className="font-normal text-cast"> (optional)</span>}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className={floor ? 'text-cast' : 'text-sm text-cast'}>
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className={floor ? 'flex items-center gap-1 font-semibold text-oxide' : 'flex items-center gap-1 text-sm font-semibold text-oxide'}>
          <AlertOctagon aria-hidden className="size-4 shrink-0" />
          {error}
        </p>
      )}
    </div>
  );
}

interface FieldProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  variant?: FieldVariant;
}

const addonClass = 'inline-flex items-center border border-cast-line bg-panel px-3 font-semibold text-cast';

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> &
  FieldProps & {
    /** A unit shown after the value, e.g. "mm"; `prefix` goes before it, e.g. "$". */
    suffix?: string;
    prefix?: string;
    /** `inline`: plain text beside the box; `addon`: a grey block joined to the box. Floor fields default to `addon`. */
    affix?: 'inline' | 'addon';
  };

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField(
  { id, label, hint, error, optional, variant = 'desk', suffix, prefix, affix = variant === 'floor' ? 'addon' : 'inline', className = '', ...input },
  ref,
) {
  const addon = affix === 'addon';
  const control = (
    <input
      ref={ref}
      id={id}
      aria-invalid={error ? true : undefined}
      aria-describedby={describedBy(id, hint, error)}
      className={`${controlClass(Boolean(error), variant)} ${className}${addon && prefix ? ' rounded-l-none' : ''}`}
      {...input}
    />
  );
  let body: ReactNode = control;
  if (addon && (prefix || suffix)) {
    body = (
      <div className={suffix ? 'flex items-stretch' : 'flex'}>
        {prefix && (
          <span aria-hidden className={`${addonClass} rounded-l-md border-r-0`}>
            {prefix}
          </span>
        )}
        {suffix ? <div className="min-w-0 flex-1 [&>input]:rounded-r-none">{control}</div> : control}
        {suffix && (
          <span aria-hidden className={`${addonClass} rounded-r-md border-l-0`}>
            {suffix}
          </span>
        )}
      </div>
    );
  } else if (prefix || suffix) {
    body = (
      <span className="flex items-center gap-2">
        {prefix && (
          <span className="text-cast" aria-hidden>
            {prefix}
          </span>
        )}
        {control}
        {suffix && <span className="shrink-0 text-cast">{suffix}</span>}
      </span>
    );
  }
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional} variant={variant}>
      {body}
    </FieldShell>
  );
});

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & FieldProps & { children: ReactNode };

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField({ id, label, hint, error, optional, variant = 'desk', children, ...select }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional} variant={variant}>
      <select ref={ref} id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)} className={controlClass(Boolean(error), variant)} {...select}>
        {children}
      </select>
    </FieldShell>
  );
});

type TextAreaFieldProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & FieldProps;

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField({ id, label, hint, error, optional, variant = 'desk', ...area }, ref) {
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} optional={optional} variant={variant}>
      <textarea
        ref={ref}
        id={id}
        rows={variant === 'floor' ? 3 : undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`${controlClass(Boolean(error), variant)} py-2`}
        {...area}
      />
    </FieldShell>
  );
});
