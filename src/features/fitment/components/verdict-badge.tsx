import { ArrowDown, ArrowUp } from 'lucide-react';
import type { Verdict } from '../../../../shared/schemas/fitment';

export const VERDICT_TEXT: Record<Verdict, { word: string; hint: string }> = {
  fits: { word: 'Fits', hint: 'inside the map with margin' },
  marginal: { word: 'Marginal', hint: 'usable, with little margin' },
  'too-small': { word: 'Too small', hint: 'go bigger' },
  'too-large': { word: 'Too large', hint: 'go smaller' },
};

const STYLE: Record<Verdict, string> = {
  fits: 'bg-machined-tint text-machined ring-machined/40',
  marginal: 'bg-amber-tint text-amber ring-amber-line/50',
  'too-small': 'bg-oxide-tint text-oxide ring-oxide/40',
  'too-large': 'bg-oxide-tint text-oxide ring-oxide/40',
};

/** The verdict's shape: filled circle, half circle, or an arrow pointing to the size to try. */
export function VerdictShape({ verdict, className = 'size-4' }: { verdict: Verdict; className?: string }) {
  if (verdict === 'too-small') return <ArrowUp aria-hidden className={className} strokeWidth={3} />;
  if (verdict === 'too-large') return <ArrowDown aria-hidden className={className} strokeWidth={3} />;
  return (
    <svg aria-hidden viewBox="0 0 16 16" className={className}>
      <circle cx="8" cy="8" r="6.5" fill={verdict === 'fits' ? 'currentColor' : 'none'} stroke="currentColor" strokeWidth="2" />
      {verdict === 'marginal' && <path d="M8 1.5 A6.5 6.5 0 0 0 8 14.5 Z" fill="currentColor" />}
    </svg>
  );
}

/**
 * `direction` adds "go bigger" / "go smaller" to a frame ruled out. When no frame serves, the next frame in that
 * direction does not serve either (the answer's next steps say what binds), so the results leave the hint out.
 */
export function VerdictBadge({ verdict, direction = true }: { verdict: Verdict; direction?: boolean }) {
  const text = VERDICT_TEXT[verdict];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-2.5 py-0.5 text-sm font-semibold ring-1 ${STYLE[verdict]}`}>
      <VerdictShape verdict={verdict} />
      {text.word}
      {direction && (verdict === 'too-small' || verdict === 'too-large') && <span className="font-normal">· {text.hint}</span>}
    </span>
  );
}
