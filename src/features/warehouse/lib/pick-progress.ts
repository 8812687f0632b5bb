import type { PickLine } from '../../../../shared/schemas/warehouse';

/** What is still to come off the shelf for this line now (back-ordered units are not). */
export const remainingToPick = (line: PickLine): number => Math.max(0, line.toPick);

/** How many this line needs from the shelf in all: what is picked plus what is left. */
export const pickTarget = (line: PickLine): number => line.picked + remainingToPick(line);

export const isLineDone = (line: PickLine): boolean => remainingToPick(line) === 0;

/** The line the picker is on: the one chosen, while it still has something to pick, else the first in walk order with something to pick. */
export function currentLine(lines: readonly PickLine[], chosenLineId: number | null): PickLine | null {
  const chosen = chosenLineId === null ? undefined : lines.find((l) => l.lineId === chosenLineId);
  if (chosen && !isLineDone(chosen)) return chosen;
  return lines.find((l) => !isLineDone(l)) ?? null;
}

/** Scanners send upper case; people typing may not. Part numbers are stored upper case. */
export const normalisePartNumber = (raw: string): string => raw.trim().toUpperCase();
