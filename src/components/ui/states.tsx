import { AlertOctagon, Inbox, LoaderCircle } from 'lucide-react';
import type { ReactNode } from 'react';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-10 text-cast">
      <LoaderCircle aria-hidden className="size-5 animate-spin text-temper" />
      <span>{label}</span>
    </div>
  );
}

export function ErrorState({ title = 'That did not load', message, onRetry }: { title?: string; message?: string; onRetry?: () => void }) {
  return (
    <div role="alert" className="my-6 flex gap-3 rounded-md border border-oxide/40 bg-oxide-tint p-4 text-ink">
      <AlertOctagon aria-hidden className="mt-0.5 size-5 shrink-0 text-oxide" />
      <div>
        <p className="font-semibold">{title}</p>
        {message && <p className="text-cast">{message}</p>}
        {onRetry && (
          <button type="button" onClick={onRetry} className="mt-2 font-semibold text-temper underline underline-offset-2 hover:text-temper-deep">
            Try again
          </button>
        )}
      </div>
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="my-6 flex gap-3 rounded-md border border-dashed border-cast-line bg-white/60 p-6">
      <Inbox aria-hidden className="mt-0.5 size-5 shrink-0 text-cast" />
      <div>
        <p className="font-semibold">{title}</p>
        {children && <div className="text-cast">{children}</div>}
      </div>
    </div>
  );
}
