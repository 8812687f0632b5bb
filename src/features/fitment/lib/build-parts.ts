import type { Application, FitmentAssumptions, Layout } from '../../../../shared/schemas/fitment';
import type { PartDetail, PartSummary } from '../../../../shared/schemas/parts';

export type Bearing = 'journal' | 'ball';
export type BuildKind = 'complete' | 'assembled';

/** What a line of the build is for, in the order a fitter lays the parts out. */
export type BuildRole = 'turbocharger' | 'cartridge' | 'compressor-housing' | 'turbine-housing' | 'seal-kit' | 'oil-feed' | 'oil-restrictor' | 'oil-drain' | 'water-lines';

export const ROLE_LABELS: Record<BuildRole, string> = {
  turbocharger: 'Complete turbocharger',
  cartridge: 'Cartridge',
  'compressor-housing': 'Compressor housing',
  'turbine-housing': 'Turbine housing',
  'seal-kit': 'Gasket and seal kit',
  'oil-feed': 'Oil feed line',
  'oil-restrictor': 'Oil feed restrictor',
  'oil-drain': 'Oil drain line',
  'water-lines': 'Coolant lines',
};

export interface BuildLine {
  role: BuildRole;
  /** Null when the catalogue has no part for this line. */
  part: PartSummary | null;
  /** Per build: one per unit, so a twin takes two of each. */
  quantity: number;
  /** Why this part, in words. */
  why: string;
}

export interface BuildPlan {
  kind: BuildKind;
  /** Whether a complete unit with this bearing and turbine A/R is sold at all. */
  completeOffered: boolean;
  compressorAr: number | null;
  inducerMm: number | null;
  turbineMaterial: string | null;
  lines: BuildLine[];
  /** Lines the catalogue cannot fill; the build cannot be ordered as one while any is missing. */
  missing: BuildRole[];
}

/** The frame's parts, as the catalogue lists them for one bearing type. */
export interface FrameStock {
  units: PartSummary[];
  cartridges: PartSummary[];
  compressorHousings: PartSummary[];
  turbineHousings: PartSummary[];
}

export interface BuildRequest {
  frameCode: string;
  layout: Layout;
  bearing: Bearing;
  turbineAr: number;
  application: Application;
  turbineInletC: FitmentAssumptions['turbineInletC'];
  /** Prefer the complete unit (when one matches) or the cartridge and housings. */
  prefer?: BuildKind;
}

const sameAr = (a: number | null | undefined, b: number) => a != null && Math.abs(a - b) < 0.005;
const onSale = (p: PartSummary, frameCode: string) => p.status === 'active' && p.frameCode === frameCode;
const canSupply = (p: PartSummary, quantity: number) => p.stock.available >= quantity;

/** Of several parts that all fit, the first that can be supplied in the quantity wanted, else the first. */
function firstSuppliable(parts: PartSummary[], quantity: number): PartSummary | null {
  return parts.find((p) => canSupply(p, quantity)) ?? parts[0] ?? null;
}

/**
 * Cast iron serves up to about 950 °C at the turbine inlet; sustained full load at that heat (circuit, marine)
 * wants cast stainless steel, as the catalogue's housing descriptions say.
 */
export function turbineMaterialFor(application: Application, turbineInletC: number): { material: string; why: string } {
  const sustained = application === 'circuit' || application === 'marine';
  if (sustained && turbineInletC >= 950) {
    return { material: 'cast stainless steel', why: `stainless: long spells at full load with about ${Math.round(turbineInletC)} °C at the turbine inlet` };
  }
  return { material: 'cast iron', why: `cast iron: about ${Math.round(turbineInletC)} °C at the turbine inlet at peak power` };
}

/**
 * The compressor housing A/R that goes with a turbine A/R: the one the frame's complete units pair with it, or with
 * the nearest turbine A/R they are sold with.
 */
export function compressorArFor(units: PartSummary[], turbineAr: number): number | null {
  const paired = units.filter((u) => u.specs.turbineAr != null && u.specs.compressorAr != null);
  const nearest = paired.reduce<PartSummary | null>(
    (best, u) => (best === null || Math.abs(u.specs.turbineAr! - turbineAr) < Math.abs(best.specs.turbineAr! - turbineAr) ? u : best),
    null,
  );
  return nearest?.specs.compressorAr ?? null;
}

/** The frame's standard compressor wheel: the inducer its complete units carry (the map is drawn for it). */
function standardInducer(stock: FrameStock): number | null {
  const fromUnits = stock.units.find((u) => u.specs.inducerMm != null)?.specs.inducerMm;
  if (fromUnits != null) return fromUnits;
  const inducers = stock.cartridges.map((c) => c.specs.inducerMm).filter((n): n is number => n != null);
  return inducers.length > 0 ? Math.min(...inducers) : null;
}

/** The main lines: the complete unit, or the cartridge with housings to suit. Fittings come from its goes-with links. */
export function planBuild(request: BuildRequest, stock: FrameStock): BuildPlan {
  const quantity = request.layout === 'twin' ? 2 : 1;
  const { frameCode, bearing, turbineAr } = request;
  const units = stock.units.filter((u) => onSale(u, frameCode) && u.condition === 'new' && u.specs.bearing === bearing);
  const inducer = standardInducer({ ...stock, units });
  const compressorAr = compressorArFor(units, turbineAr);
  const material = turbineMaterialFor(request.application, request.turbineInletC);
  const complete = firstSuppliable(
    units.filter((u) => sameAr(u.specs.turbineAr, turbineAr)),
    quantity,
  );

  const cartridge = firstSuppliable(
    stock.cartridges.filter((c) => onSale(c, frameCode) && c.specs.bearing === bearing && c.specs.inducerMm === inducer),
    quantity,
  );
  const compressorHousing =
    compressorAr === null
      ? null
      : firstSuppliable(
          stock.compressorHousings.filter((h) => onSale(h, frameCode) && sameAr(h.specs.compressorAr, compressorAr) && h.specs.inducerMm === (cartridge?.specs.inducerMm ?? inducer)),
          quantity,
        );
  const housingsAtAr = stock.turbineHousings.filter((h) => onSale(h, frameCode) && sameAr(h.specs.turbineAr, turbineAr));
  // The material wanted first; stainless may stand in for iron when iron is short, never the other way round.
  const materialOrder = material.material === 'cast iron' ? ['cast iron', 'cast stainless steel'] : ['cast stainless steel'];
  const turbineHousing = firstSuppliable(
    materialOrder.flatMap((m) => housingsAtAr.filter((h) => h.specs.material === m)),
    quantity,
  );

  const assembledSuppliable = [cartridge, compressorHousing, turbineHousing].every((p) => p !== null && canSupply(p, quantity));
  const kind: BuildKind =
    complete === null ? 'assembled' : request.prefer ?? (canSupply(complete, quantity) || !assembledSuppliable ? 'complete' : 'assembled');

  const lines: BuildLine[] =
    kind === 'complete'
      ? [
          {
            role: 'turbocharger',
            part: complete,
            quantity,
            why: `${bearing === 'ball' ? 'ball' : 'journal'} bearing, ${turbineAr.toFixed(2)} A/R turbine, ${complete?.specs.compressorAr?.toFixed(2) ?? '—'} A/R compressor housing, assembled and balanced`,
          },
        ]
      : [
          {
            role: 'cartridge',
            part: cartridge,
            quantity,
            why: `${bearing === 'ball' ? 'ball' : 'journal'} bearing, ${inducer ?? '—'} mm inducer: the wheel this frame’s map is drawn for`,
          },
          {
            role: 'compressor-housing',
            part: compressorHousing,
            quantity,
            why: `${compressorAr?.toFixed(2) ?? '—'} A/R, bored for the cartridge’s ${cartridge?.specs.inducerMm ?? inducer ?? '—'} mm inducer`,
          },
          {
            role: 'turbine-housing',
            part: turbineHousing,
            quantity,
            why:
              turbineHousing && turbineHousing.specs.material !== material.material
                ? `${turbineAr.toFixed(2)} A/R; stainless in place of cast iron, which is short of stock`
                : `${turbineAr.toFixed(2)} A/R, ${material.why}`,
          },
        ];

  return {
    kind,
    completeOffered: complete !== null,
    compressorAr: kind === 'complete' ? (complete?.specs.compressorAr ?? compressorAr) : compressorAr,
    inducerMm: kind === 'complete' ? (complete?.specs.inducerMm ?? inducer) : (cartridge?.specs.inducerMm ?? inducer),
    turbineMaterial: kind === 'complete' ? (complete?.specs.material ?? null) : (turbineHousing?.specs.material ?? null),
    lines,
    missing: lines.filter((l) => l.part === null).map((l) => l.role),
  };
}

/** Which goes-with link fills which fitting line: the catalogue names its fittings by what they are. */
const FITTINGS: Array<{ role: BuildRole; words: string; when: (main: PartSummary) => boolean; why: string }> = [
  { role: 'seal-kit', words: 'gasket and seal kit', when: () => true, why: 'every gasket, O-ring and washer for fitting the unit' },
  { role: 'oil-feed', words: 'oil feed line', when: () => true, why: 'braided feed from the engine’s oil gallery' },
  {
    role: 'oil-restrictor',
    words: 'oil feed restrictor',
    when: (main) => main.specs.bearing === 'ball',
    why: 'a ball-bearing centre housing needs a restricted oil feed',
  },
  { role: 'oil-drain', words: 'oil drain line', when: () => true, why: 'a free gravity drain back to the sump, above oil level' },
  {
    role: 'water-lines',
    words: 'water line kit',
    when: (main) => main.specs.cooling === 'oil and water',
    why: 'the centre housing is water-cooled',
  },
];

/** The fitting lines for the main part, from its goes-with links; a fitting it has no link for is listed as missing. */
export function fittingLines(main: PartDetail, quantity: number): BuildLine[] {
  return FITTINGS.filter((f) => f.when(main)).map((f) => {
    const matches = main.goesWith.filter((p) => p.category === 'gaskets-fittings' && p.status === 'active' && p.title.toLowerCase().includes(f.words));
    // The frame's own fitting first; one shared by several frames after it.
    const ordered = [...matches.filter((p) => p.frameCode === main.frameCode), ...matches.filter((p) => p.frameCode !== main.frameCode)];
    return { role: f.role, part: firstSuppliable(ordered, quantity), quantity, why: f.why };
  });
}
