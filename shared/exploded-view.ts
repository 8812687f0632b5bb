import type { CategorySlug } from './catalog';

/**
 * The exploded view of a frame: which pieces it is drawn in, which catalogue parts each piece opens, and the
 * clocked positions its housings bolt on in. One place for the drawing, the frame page, the part page, the cart and
 * the server's checks.
 */

export const PIECE_IDS = ['compressor-cover', 'diffuser-plate', 'cartridge', 'turbine-housing', 'turbine-joint', 'gaskets'] as const;
export type PieceId = (typeof PIECE_IDS)[number];

/** Which way the turbine housing is held to the centre housing. */
export type TurbineJoint = 'bolts' | 'clamp';

export interface FrameForView {
  code: string;
  flangePattern: string;
}

/**
 * The joint is not in the frame data. Our choice: frames whose turbine inlet is a V-band (the larger ones) hold the
 * turbine housing to the centre housing with a V-band clamp too; the others with a ring of bolts and clamp plates.
 */
export function turbineJointOf(frame: Pick<FrameForView, 'flangePattern'>): TurbineJoint {
  return frame.flangePattern.startsWith('V-band') ? 'clamp' : 'bolts';
}

export interface Piece {
  id: PieceId;
  name: string;
  /** What the piece is, in a sentence, for the list beside the drawing. */
  what: string;
  /** The catalogue categories whose parts of the frame this piece opens; empty when the piece is not sold alone. */
  categories: readonly CategorySlug[];
  /** Said in place of a list when the piece has no parts of its own. */
  noPartsText: string;
  side: 'intake' | 'centre' | 'exhaust' | 'joints';
}

/** The pieces of a frame, from the intake side to the exhaust side, gaskets last. */
export function piecesOf(frame: Pick<FrameForView, 'flangePattern'>): Piece[] {
  const joint = turbineJointOf(frame);
  return [
    {
      id: 'compressor-cover',
      name: 'Compressor cover',
      what: 'Cast aluminium compressor housing on the intake side, sold by A/R and inducer bore.',
      categories: ['compressor-housings'],
      noPartsText: 'No compressor housings for this frame are on sale.',
      side: 'intake',
    },
    {
      id: 'diffuser-plate',
      name: 'Adapter (diffuser) plate',
      what: 'Bolted into the compressor cover; sold fitted in each compressor housing.',
      categories: ['compressor-housings'],
      noPartsText: 'No compressor housings (which carry the plate) for this frame are on sale.',
      side: 'intake',
    },
    {
      id: 'cartridge',
      name: 'Cartridge',
      what: 'Centre housing and rotating assembly: shaft, both wheels, bearings and seals, the compressor wheel held by a nut.',
      categories: ['cartridges'],
      noPartsText: 'No cartridges for this frame are on sale.',
      side: 'centre',
    },
    {
      id: 'turbine-housing',
      name: 'Turbine housing',
      what: 'Cast iron or steel housing on the exhaust side, sold by A/R and inlet flange.',
      categories: ['turbine-housings'],
      noPartsText: 'No turbine housings for this frame are on sale.',
      side: 'exhaust',
    },
    {
      id: 'turbine-joint',
      name: joint === 'clamp' ? 'Turbine housing clamp' : 'Turbine housing bolts',
      what:
        joint === 'clamp'
          ? 'A V-band clamp holds the turbine housing to the centre housing.'
          : 'A ring of bolts with clamp plates holds the turbine housing to the centre housing.',
      categories: [],
      noPartsText:
        joint === 'clamp'
          ? 'Not sold on its own: the clamp comes with every turbine housing and complete unit of this frame.'
          : 'Not sold on their own: the bolts and clamp plates come with every turbine housing and complete unit of this frame.',
      side: 'joints',
    },
    {
      id: 'gaskets',
      name: 'Gaskets and fittings',
      what: 'Gaskets and seals between the pieces, oil and water lines, clamps and couplers.',
      categories: ['gaskets-fittings'],
      noPartsText: 'No gaskets or fittings for this frame are on sale.',
      side: 'joints',
    },
  ];
}

/** The piece a part of a category is drawn as; a complete unit is every piece at once (null). */
export function pieceForCategory(category: string): PieceId | null {
  switch (category) {
    case 'compressor-housings':
      return 'compressor-cover';
    case 'cartridges':
      return 'cartridge';
    case 'turbine-housings':
      return 'turbine-housing';
    case 'gaskets-fittings':
      return 'gaskets';
    default:
      return null;
  }
}

/**
 * The parts a piece opens: the frame's own parts (the frame named on the part) in the piece's categories, in the
 * order given. `parts` is what the catalogue lists for the frame (superseded numbers left out, as the catalogue does).
 */
export function partsOfPiece<T extends { category: string; frameCode: string | null }>(piece: Pick<Piece, 'categories'>, frameCode: string, parts: readonly T[]): T[] {
  return parts.filter((p) => p.frameCode === frameCode && (piece.categories as readonly string[]).includes(p.category));
}

/** The catalogue list of the same parts, or null for a piece not sold on its own. */
export function catalogueLinkOf(piece: Pick<Piece, 'categories'>, frameCode: string): string | null {
  const category = piece.categories[0];
  if (!category) return null;
  return `/catalogue?${new URLSearchParams({ frame: frameCode, category }).toString()}`;
}

/* Clocked positions. */

/** Clock positions are stated looking at the unit from this side (our choice, shown on every screen that names one). */
export const VIEWED_FROM = 'viewed from the compressor inlet';

/** Every position we name: the hour, and the half hours between (a housing clocked every 45° lands on them). */
export const CLOCK_POSITIONS = ['12:00', '1:30', '2:00', '3:00', '4:00', '4:30', '6:00', '7:30', '8:00', '9:00', '10:00', '10:30'] as const;
export type ClockPosition = (typeof CLOCK_POSITIONS)[number];

export const isClockPosition = (v: string): v is ClockPosition => (CLOCK_POSITIONS as readonly string[]).includes(v);

/** Degrees clockwise from 12 o'clock. */
export function clockAngle(position: ClockPosition): number {
  const [h, m] = position.split(':').map(Number) as [number, number];
  return ((h % 12) * 30 + m / 2) % 360;
}

/** "12 o'clock", "1:30": how the trade says it. */
export function clockWords(position: ClockPosition): string {
  return position.endsWith(':00') ? `${position.slice(0, -3)} o'clock` : position;
}

export interface FrameClocking {
  compressorOutlet: readonly ClockPosition[];
  turbineInlet: readonly ClockPosition[];
  standard: Orientation;
}

export interface Orientation {
  compressorOutlet: ClockPosition;
  turbineInlet: ClockPosition;
}

/** Compressor outlet straight up, turbine inlet straight down: how a unit leaves us unless asked otherwise (our choice). */
export const STANDARD_ORIENTATION: Orientation = { compressorOutlet: '12:00', turbineInlet: '6:00' };

/**
 * The positions a frame's housings bolt on in. Our choice, matching the catalogue's housings: a compressor cover
 * is held by a clamp ring and clocks every 45° (8 positions); a turbine housing clocks every 60° (6 positions), set
 * by the six bolts of the bolted frames and kept at the same steps on the clamped ones so every housing of the
 * catalogue states the same positions. The standard position (how a unit leaves us unless asked otherwise) is the
 * compressor outlet at 12 o'clock and the turbine inlet at 6 o'clock, on every frame (our choice).
 */
export function clockingOf(_frame: FrameForView): FrameClocking {
  return {
    compressorOutlet: ['12:00', '1:30', '3:00', '4:30', '6:00', '7:30', '9:00', '10:30'],
    turbineInlet: ['12:00', '2:00', '4:00', '6:00', '8:00', '10:00'],
    standard: STANDARD_ORIENTATION,
  };
}

/** Only complete units are built to an orientation; a housing alone is clocked by whoever fits it. */
export const takesOrientation = (category: string) => category === 'turbochargers';

/** Why an orientation is refused for a part, or null when it is allowed. */
export function orientationProblem(part: { category: string; frameCode: string | null; partNumber: string }, frame: FrameForView | null, orientation: { compressorOutlet: string; turbineInlet: string }): string | null {
  if (!takesOrientation(part.category) || !frame || part.frameCode !== frame.code) {
    return `${part.partNumber} is not a complete turbocharger: only complete units are built to a chosen orientation`;
  }
  const clocking = clockingOf(frame);
  if (!(clocking.compressorOutlet as readonly string[]).includes(orientation.compressorOutlet)) {
    return `Frame ${frame.code} offers the compressor outlet at ${clocking.compressorOutlet.map(clockWords).join(', ')}`;
  }
  if (!(clocking.turbineInlet as readonly string[]).includes(orientation.turbineInlet)) {
    return `Frame ${frame.code} offers the turbine inlet at ${clocking.turbineInlet.map(clockWords).join(', ')}`;
  }
  return null;
}

/** One line for carts, orders, pick lists, slips and mail. */
export function orientationText(o: Orientation, standard: Orientation = STANDARD_ORIENTATION): string {
  const isStandard = standard.compressorOutlet === o.compressorOutlet && standard.turbineInlet === o.turbineInlet;
  return `Compressor outlet ${clockWords(o.compressorOutlet)}, turbine inlet ${clockWords(o.turbineInlet)} (${VIEWED_FROM})${isStandard ? ', standard position' : ''}`;
}

/** An orientation read from stored columns; null unless both are positions we name. */
export function orientationFrom(compressorOutlet: string | null, turbineInlet: string | null): Orientation | null {
  return compressorOutlet && turbineInlet && isClockPosition(compressorOutlet) && isClockPosition(turbineInlet) ? { compressorOutlet, turbineInlet } : null;
}

/** The words for stored columns, or undefined for a line without an orientation. */
export function orientationWords(compressorOutlet: string | null, turbineInlet: string | null): string | undefined {
  const o = orientationFrom(compressorOutlet, turbineInlet);
  return o ? orientationText(o) : undefined;
}
