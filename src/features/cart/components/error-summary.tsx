import { OctagonAlert } from 'lucide-react';
import { useEffect, useRef } from 'react';

export interface SummaryItem {
  fieldId: string;
  message: string;
}

/** The list at the top of a form after a failed submit; each entry links to its field. Takes focus when it appears. */
export function ErrorSummary({ items, title = 'Please fix these before you continue', focusKey }: { items: SummaryItem[]; title?: string; focusKey: number }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (items.length > 0) ref.current?.focus();
    // Focus again on every failed submit, not only when the list changes.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focusKey]);
  if (items.length === 0) return null;
  return (
    <div ref={ref} tabIndex={-1} role="alert" aria-labelledby="error-summary-title" className="rounded-md border-2 border-oxide bg-oxide-tint p-4">
      <p id="error-summary-title" className="inline-flex items-center gap-2 font-bold text-oxide">
        <OctagonAlert aria-hidden className="size-5" />
        {title}
      </p>
      <ul className="mt-2 list-disc pl-6">
        {items.map((i) => (
          <li key={i.fieldId}>
            <a
              href={`#${i.fieldId}`}
              className="font-semibold text-oxide underline"
              onClick={(e) => {
                e.preventDefault();
                document.getElementById(i.fieldId)?.focus();
              }}
            >
              {i.message}
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}
