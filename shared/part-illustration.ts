import type { CategorySlug } from './catalog';

/** The kinds of part we draw a line illustration for. */
export const ILLUSTRATION_KINDS = [
  'turbocharger',
  'cartridge',
  'compressor-housing',
  'turbine-housing',
  'flange-gasket',
  'hose-line',
  'silicone-coupler',
  'v-band-clamp',
  'small-fitting',
  'dash-gauge',
  'sensor-probe',
  'plug-in-logger',
] as const;
export type IllustrationKind = (typeof ILLUSTRATION_KINDS)[number];

/** Which kinds each category may show; the first is the category's own drawing, used when nothing more specific matches. */
export const KINDS_BY_CATEGORY: Record<CategorySlug, readonly [IllustrationKind, ...IllustrationKind[]]> = {
  turbochargers: ['turbocharger'],
  cartridges: ['cartridge'],
  'compressor-housings': ['compressor-housing'],
  'turbine-housings': ['turbine-housing'],
  'gaskets-fittings': ['flange-gasket', 'hose-line', 'silicone-coupler', 'v-band-clamp', 'small-fitting'],
  'gauges-sensors': ['dash-gauge', 'sensor-probe', 'plug-in-logger'],
  // Bearings, seals and O-rings in a bag: the seal drawing stands for the kit.
  'rebuild-kits': ['flange-gasket'],
};

/** What the choice needs: a part, a cart line or a pick line all carry these. */
export interface IllustrationInput {
  category: string;
  title: string;
  /** Only the mounting matters (a gauge type alone does not say whether it is a dash gauge or a sender). */
  specs?: { mounting?: string | null } | null;
}

// Title words in priority order: a fitting before a line (a restrictor's title may name the line it goes in), a
// "dash gauge" before the "sensor" of a sensor kit.
const TITLE_RULES: ReadonlyArray<readonly [IllustrationKind, RegExp]> = [
  ['compressor-housing', /\bcompressor housing/],
  ['turbine-housing', /\bturbine housing/],
  ['cartridge', /\bcartridge|\bchra\b/],
  ['turbocharger', /\bturbocharger/],
  ['flange-gasket', /\bgasket|\bseal kit|\bo-rings?\b/],
  ['silicone-coupler', /\bcoupler|\breducer hose|\bhump hose/],
  ['v-band-clamp', /\bclamp/],
  ['small-fitting', /\brestrictor|\badaptor|\badapter|\bbung\b|\bboss\b|\bunion\b|\bbanjo|\bfitting/],
  ['hose-line', /\blines?\b|\bhose|\bpipe/],
  ['plug-in-logger', /\blogger|\busb\b/],
  ['dash-gauge', /\bgauge\b/],
  ['sensor-probe', /\bprobe|\bsender|\bsensor|\bthermocouple/],
];

// The mounting says what the thing physically is, so for gauges and sensors it outranks the title.
const MOUNTING_RULES: ReadonlyArray<readonly [IllustrationKind, RegExp]> = [
  ['plug-in-logger', /\blogger|\busb\b/],
  ['dash-gauge', /\bdash\b|\bpod\b|\bpanel\b|\bgauge\b/],
  ['sensor-probe', /\bsender|\bsensor|\bprobe|\bthread|\bcompression fitting/],
];

const isCategory = (c: string): c is CategorySlug => Object.hasOwn(KINDS_BY_CATEGORY, c);

function firstMatch(rules: ReadonlyArray<readonly [IllustrationKind, RegExp]>, text: string, allowed: readonly IllustrationKind[]) {
  return rules.find(([kind, words]) => allowed.includes(kind) && words.test(text))?.[0];
}

/**
 * The drawing for a part: its category decides the family, the mounting and then the title's words pick the kind
 * within it, and the category's own drawing is the fallback. A part is never drawn as another category's kind.
 */
export function illustrationKind({ category, title, specs }: IllustrationInput): IllustrationKind {
  // Categories are enforced by the database; an unknown one goes by its title alone, else the shop's emblem.
  const allowed = isCategory(category) ? KINDS_BY_CATEGORY[category] : ILLUSTRATION_KINDS;
  const fallback = isCategory(category) ? KINDS_BY_CATEGORY[category][0] : 'turbocharger';
  if (allowed.length === 1) return fallback;
  const mounting = specs?.mounting?.toLowerCase() ?? '';
  return firstMatch(MOUNTING_RULES, mounting, allowed) ?? firstMatch(TITLE_RULES, title.toLowerCase(), allowed) ?? fallback;
}
