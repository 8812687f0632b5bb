import { ScanBarcode } from 'lucide-react';
import { forwardRef, useEffect, useImperativeHandle, useRef, type InputHTMLAttributes, type ReactNode } from 'react';
import { describedBy } from '../../../components/ui/form';

const typing = (el: Element | null) => el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement || (el as HTMLElement | null)?.isContentEditable;

/**
 * Keeps a scan field focused: a scanner types like a keyboard and must never land its characters nowhere.
 * Focus comes back when it falls to the page (a click on empty space, a finished request), and any printable key
 * pressed while nothing typeable has focus goes into the field. Tabbing to a button still works, so every action
 * stays reachable from the keyboard; `hold` pauses this while a dialog is open.
 */
export function useKeepFocus(ref: React.RefObject<HTMLInputElement | null>, hold = false) {
  useEffect(() => {
    if (hold) return;
    const input = ref.current;
    if (!input) return;
    const onBlur = (e: FocusEvent) => {
      if (e.relatedTarget === null) requestAnimationFrame(() => (document.activeElement === document.body || document.activeElement === null) && input.focus());
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.ctrlKey || e.metaKey || e.altKey || e.key.length !== 1) return;
      if (typing(document.activeElement)) return;
      // Focusing during keydown sends this very character into the field.
      input.focus();
    };
    input.addEventListener('blur', onBlur);
    document.addEventListener('keydown', onKey);
    if (document.activeElement === document.body) input.focus();
    return () => {
      input.removeEventListener('blur', onBlur);
      document.removeEventListener('keydown', onKey);
    };
  }, [ref, hold]);
}

type ScanFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'size'> & {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  hold?: boolean;
  /** Off where a form has several fields and the scan is only one of them. */
  keepFocus?: boolean;
};

/** A big part-number (or tracking-number) field a scanner types into, ending with Enter. */
export const ScanField = forwardRef<HTMLInputElement, ScanFieldProps>(function ScanField({ id, label, hint, error, hold = false, keepFocus = true, className = '', ...input }, ref) {
  const inner = useRef<HTMLInputElement>(null);
  useImperativeHandle(ref, () => inner.current as HTMLInputElement);
  useKeepFocus(inner, hold || !keepFocus);
  return (
    <div className="grid gap-1">
      <label htmlFor={id} className="flex items-center gap-2 text-lg font-semibold">
        <ScanBarcode aria-hidden className="size-6 text-temper" />
        {label}
      </label>
      <input
        ref={inner}
        id={id}
        type="text"
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        autoFocus={keepFocus}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`part-no min-h-16 w-full rounded-md border-4 bg-white px-4 text-3xl text-ink focus:border-temper focus:bg-temper-tint/40 ${error ? 'border-oxide' : 'border-cast'} ${className}`}
        {...input}
      />
      {hint && (
        <p id={`${id}-hint`} className="text-cast">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="font-semibold text-oxide">
          {error}
        </p>
      )}
    </div>
  );
});
