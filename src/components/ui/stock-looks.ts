/**
 * The tones of states, and the stock states' looks: the catalogue and part pages show stock without the other
 * statuses' icons (src/components/ui/status-looks.ts has the rest, and re-exports these).
 */
import { Ban, CircleCheck, Clock, TriangleAlert, type LucideIcon } from 'lucide-react';
import type { z } from 'zod';
import type { StockStateSchema } from '../../../shared/schemas/parts';

/** The design's colours for states: temper (in hand), amber (attention), machined (done, good), oxide (refused, ended), cast (neutral). */
export type Tone = 'temper' | 'amber' | 'machined' | 'oxide' | 'cast';

export interface StatusLook {
  label: string;
  Icon: LucideIcon;
  tone: Tone;
}

export type StockState = z.infer<typeof StockStateSchema>;

export const STOCK_STATE_LOOKS: Record<StockState, StatusLook> = {
  'in-stock': { label: 'In stock', Icon: CircleCheck, tone: 'machined' },
  low: { label: 'Low stock', Icon: TriangleAlert, tone: 'amber' },
  'out-of-stock': { label: 'Awaiting stock', Icon: Clock, tone: 'cast' },
  discontinued: { label: 'Discontinued', Icon: Ban, tone: 'oxide' },
};

/** A stock state's look; one the client does not know yet (a newer server) reads as its own words, in neutral grey. */
export function stockLook(state: string): StatusLook {
  return (STOCK_STATE_LOOKS as Record<string, StatusLook | undefined>)[state] ?? { label: state.replace(/[_-]/g, ' '), Icon: Clock, tone: 'cast' };
}

/** Pill colours per tone: tinted background, dark text and border, each pair at least 4.5:1 (WCAG 2.2 AA). */
export const TONE_PILL: Record<Tone, string> = {
  temper: 'bg-temper-tint text-temper-deep border-temper/40',
  amber: 'bg-amber-tint text-amber border-amber-line/50',
  machined: 'bg-machined-tint text-machined border-machined/40',
  oxide: 'bg-oxide-tint text-oxide border-oxide/40',
  cast: 'bg-panel text-ink border-cast-line',
};

/** Text colours per tone for the plain (unboxed) form, as in lists and stock lines. */
export const TONE_TEXT: Record<Tone, string> = {
  temper: 'text-temper-deep',
  amber: 'text-amber',
  machined: 'text-machined',
  oxide: 'text-oxide',
  cast: 'text-cast',
};
