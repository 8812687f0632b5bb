import type { ReactNode } from 'react';
import { statusLook, TONE_PILL, TONE_TEXT, type StatusKind, type StatusOf } from './status-looks';

type StatusBadgeProps = {
  [K in StatusKind]: {
    kind: K;
    status: StatusOf<K>;
    /** `pill` (default) in tables and headers; `plain` is the word and shape in the tone's colour, for lists and stock lines. */
    look?: 'pill' | 'plain';
    /** Words that say more than the label, e.g. a stock count; the icon and colour stay the status's own. */
    children?: ReactNode;
    /** `md` for Floor screens, read at arm's length. */
    size?: 'sm' | 'md';
    className?: string;
  };
}[StatusKind];

/** A status as a word and a shape, never colour alone. */
export function StatusBadge({ kind, status, look = 'pill', size = 'sm', children, className = '' }: StatusBadgeProps) {
  const { label, Icon, tone } = statusLook(kind, status);
  const box =
    look === 'pill'
      ? `inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2.5 py-0.5 ${size === 'md' ? 'gap-1.5' : 'text-sm'} font-semibold ${TONE_PILL[tone]}`
      : `inline-flex items-center gap-1 font-semibold ${TONE_TEXT[tone]}`;
  return (
    <span className={`${box} ${className}`}>
      <Icon aria-hidden className="size-4 shrink-0" />
      {children ?? label}
    </span>
  );
}
