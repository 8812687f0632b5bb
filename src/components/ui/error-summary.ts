import { useEffect, useRef, useState, type ReactNode } from 'react';
import { get, type FieldErrors, type FieldValues, type Path, type SubmitErrorHandler, type SubmitHandler, type UseFormReturn } from 'react-hook-form';
import { ApiError } from '../../lib/api-client';

/**
 * A field the summary can name and link to: its form name (dotted for nested), its element id and its label. Leave
 * the label out where the form's messages already name their field ("Displacement is required").
 */
export interface SummaryField {
  name: string;
  id: string;
  label?: string;
}

export interface SummaryItem {
  id: string;
  message: string;
}

/** The field errors in the order the fields appear, each pointing at its field's id. */
export function summaryItems<T extends FieldValues>(errors: FieldErrors<T>, fields: readonly SummaryField[]): SummaryItem[] {
  const items: SummaryItem[] = [];
  for (const f of fields) {
    const message = (get(errors, f.name) as { message?: unknown } | undefined)?.message;
    if (typeof message === 'string') items.push({ id: f.id, message: f.label ? `${f.label}: ${message}` : message });
  }
  return items;
}

/** The server's `fieldErrors` that belong to a field on this form, first message each, in the form's order. */
export function serverFieldErrors(error: unknown, fields: readonly SummaryField[]): Array<{ name: string; message: string }> {
  if (!(error instanceof ApiError)) return [];
  return fields.flatMap((f) => {
    const message = error.fieldErrors[f.name]?.[0];
    return message ? [{ name: f.name, message }] : [];
  });
}

/**
 * The server's own message, unless everything it said is already placed beside a field: a 400 whose every field
 * error has a field on the form needs no second sentence; a 409, a network failure or an error about something
 * the form does not show keeps its message.
 */
export function serverMessage(error: unknown, fields: readonly SummaryField[]): string | undefined {
  if (!(error instanceof Error)) return 'That did not work. Try again.';
  if (error instanceof ApiError) {
    const keys = Object.keys(error.fieldErrors);
    if (keys.length > 0 && keys.every((k) => fields.some((f) => f.name === k))) return undefined;
  }
  return error.message;
}

export interface ErrorSummaryOptions {
  /** Problems react-hook-form does not hold (a file the browser refused), listed after the fields. */
  extraItems?: readonly SummaryItem[];
  /** How a link reaches its field when plain focus is not enough (the field sits in a closed section). */
  focusField?: (id: string) => void;
}

/**
 * The error summary at the top of a form (DESIGN.md, Forms): on a refused submit it lists each field's message
 * with a link that focuses the field, plus the server's message where it has one, and takes focus itself, again
 * on every refused submit. Render `{summary.shown && <ErrorSummary {...summary.props} />}` and submit through
 * `summary.handleSubmit`.
 */
export function useErrorSummary<T extends FieldValues, TOut = T>(form: UseFormReturn<T, unknown, TOut>, fields: readonly SummaryField[], options: ErrorSummaryOptions = {}) {
  const ref = useRef<HTMLDivElement>(null);
  const [shown, setShown] = useState(false);
  const [formError, setFormError] = useState<ReactNode>(undefined);
  const [refusedTitle, setRefusedTitle] = useState<string | undefined>(undefined);
  // Set on each refusal; the summary takes focus after the first render that shows it (the field errors may reach
  // the form a render after the refusal itself), and again on every refused submit.
  const focusPending = useRef(false);
  // A refusal like the last one changes no other state; this still renders, so the focus moves again.
  const [, setRefusals] = useState(0);
  useEffect(() => {
    if (focusPending.current && ref.current) {
      focusPending.current = false;
      ref.current.focus();
    }
  });

  const show = (message: ReactNode, title?: string) => {
    setFormError(message);
    setRefusedTitle(title);
    setShown(true);
    focusPending.current = true;
    setRefusals((n) => n + 1);
  };
  const hide = () => {
    setShown(false);
    setFormError(undefined);
    setRefusedTitle(undefined);
  };

  return {
    shown,
    props: {
      ref,
      items: [...summaryItems(form.formState.errors, fields), ...(options.extraItems ?? [])],
      formError,
      refusedTitle,
      focusField: options.focusField,
    },
    hide,
    /** The form's own rules refused it: list the fields. */
    showInvalid: () => show(undefined),
    /**
     * The server refused it: its field errors go beside their fields and into the list; `message` (default: the
     * server's own, when it adds something) heads the summary, under `title` when no field is named (e.g.
     * "Payment declined").
     */
    showServerError: (error: unknown, message?: ReactNode, title?: string) => {
      for (const { name, message: m } of serverFieldErrors(error, fields)) form.setError(name as Path<T>, { type: 'server', message: m });
      show(message ?? serverMessage(error, fields), title);
    },
    /** `form.handleSubmit` that hides the summary on a valid submit and shows it on an invalid one. */
    handleSubmit: (onValid: SubmitHandler<TOut>, onInvalid?: SubmitErrorHandler<T>) =>
      form.handleSubmit(
        (values, event) => {
          hide();
          return onValid(values, event);
        },
        (errors, event) => {
          void onInvalid?.(errors, event);
          show(undefined);
        },
      ),
  };
}
