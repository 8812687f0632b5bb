import { CalendarClock, TriangleAlert } from 'lucide-react';
import { formatDate } from '../../../../shared/format';
import { daysUntil } from '../../../../shared/service-due';

const today = () => new Date().toISOString().slice(0, 10);

/** When the unit is next due: a word and a shape for "due", never colour alone. */
export function ServiceDue({ dueOn }: { dueOn: string }) {
  const days = daysUntil(dueOn, today());
  if (days <= 0) {
    return (
      <span className="inline-flex items-center gap-1 font-semibold text-amber">
        <TriangleAlert aria-hidden className="size-4 shrink-0" />
        Due now <span className="tabular font-normal text-ink">({formatDate(`${dueOn}T12:00:00Z`)})</span>
      </span>
    );
  }
  return (
    <span className="inline-flex items-center gap-1">
      <CalendarClock aria-hidden className="size-4 shrink-0 text-cast" />
      <span className="tabular">{formatDate(`${dueOn}T12:00:00Z`)}</span>
      {days <= 30 && <span className="text-cast">(in {days} day{days === 1 ? '' : 's'})</span>}
    </span>
  );
}
