import { TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';

/** An amber block with a warning icon: one or two short sentences and, where useful, a link to more. */
export function Caution({ title, children }: { title: string; children: ReactNode }) {
  return (
    <aside aria-label={title} className="flex gap-3 rounded-md border-l-4 border-amber-line bg-amber-tint p-4 text-ink">
      <TriangleAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-amber" />
      <div>
        <p className="font-semibold text-amber">{title}</p>
        <div className="text-ink">{children}</div>
      </div>
    </aside>
  );
}
