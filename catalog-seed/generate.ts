import {
  CATEGORY_GROUP,
  EXCHANGE_SUFFIX,
  INSTRUMENT_PREFIX,
  SHARED_FLANGE_PREFIX,
  formatPartNumber,
  normalizePartNumber,
  parsePartNumber,
} from '../shared/part-number';
import { type CategorySlug, trimPct } from '../shared/catalog';
import { gtinForPart } from '../shared/gtin';
import { FRAMES, HOUSE_BRAND, type FrameSeed, flangeInletMm, isVBand, turbineHousingArs } from './frames';

export interface SpecSeed {
  compressorAr?: number;
  turbineAr?: number;
  trimPct?: number;
  inducerMm?: number;
  exducerMm?: number;
  flangePattern?: string;
  inletMm?: number;
  outletMm?: number;
  material?: string;
  bearing?: 'journal' | 'ball';
  wastegate?: string;
  cooling?: string;
  gaugeType?: string;
  rangeText?: string;
  mounting?: string;
  connection?: string;
}

export interface PartSeed {
  partNumber: string;
  /**
   * GTIN-13 (shared/gtin.ts), its item reference the part's place in the catalogue counted from 1: the id the part
   * gets when the catalogue is loaded into an empty database, which load.ts checks.
   */
  gtin: string;
  title: string;
  category: string;
  frameCode: string | null;
  status: 'active' | 'superseded' | 'discontinued';
  condition: 'new' | 'exchange';
  priceCents: number;
  coreDepositCents: number;
  weightGrams: number;
  description: string;
  supersededBy: string | null;
  minStock: number;
  specs: SpecSeed;
  aliases: Array<{ alias: string; kind: 'cross-reference' | 'superseded'; source: string }>;
  /** Part numbers that go with this one. */
  goesWith: string[];
  /** Quantity on hand per bin code. */
  stock: Array<{ binCode: string; onHand: number }>;
}

export interface BinSeed {
  code: string;
  zone: string;
  walkOrder: number;
}

export interface CatalogueSeed {
  frames: FrameSeed[];
  parts: PartSeed[];
  bins: BinSeed[];
}

/** Small, fast, deterministic PRNG (mulberry32), so the same seed always makes the same catalogue. */
export function createRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const roundPrice = (dollars: number) => Math.round(dollars) * 100 - 1;

function makeBins(): BinSeed[] {
  const result: BinSeed[] = [];
  // Zones in the order a picker walks them: heavy units near dispatch at the end.
  const zones = ['A', 'B', 'C', 'D', 'E', 'F'];
  let walk = 10;
  for (const zone of zones) {
    for (let bay = 1; bay <= 12; bay++) {
      // Snake through the aisle: odd bays bottom-up, even bays top-down.
      const levels = bay % 2 === 1 ? [1, 2, 3, 4] : [4, 3, 2, 1];
      for (const level of levels) {
        result.push({ code: `${zone}-${String(bay).padStart(2, '0')}-${level}`, zone, walkOrder: walk });
        walk += 10;
      }
    }
  }
  return result;
}

interface Builder {
  parts: PartSeed[];
  byNumber: Map<string, PartSeed>;
  serial: Map<string, number>;
}

/** Live serials start at 0201; earlier (superseded) numbers of a part sit 100 lower, so they read as older. */
const FIRST_SERIAL = 201;
const EARLIER_NUMBER_OFFSET = 100;

function nextNumber(b: Builder, prefix: string, category: CategorySlug, line = 0): string {
  const key = `${prefix}-${CATEGORY_GROUP[category]}${line}`;
  const serial = b.serial.get(key) ?? FIRST_SERIAL;
  b.serial.set(key, serial + 1);
  return formatPartNumber({ prefix, group: CATEGORY_GROUP[category], line, serial });
}

function add(
  b: Builder,
  part: Omit<PartSeed, 'gtin' | 'aliases' | 'goesWith' | 'stock' | 'status' | 'supersededBy' | 'minStock' | 'coreDepositCents' | 'condition'> & Partial<PartSeed>,
): PartSeed {
  const full: PartSeed = {
    status: 'active',
    condition: 'new',
    coreDepositCents: 0,
    supersededBy: null,
    minStock: 2,
    aliases: [],
    goesWith: [],
    stock: [],
    ...part,
    // Numbered here, whatever part it was copied from (a revision, an earlier number, a synthetic variant).
    gtin: gtinForPart(b.parts.length + 1),
  };
  b.parts.push(full);
  b.byNumber.set(full.partNumber, full);
  return full;
}

/** The larger-trim cartridge of a frame runs a 5 % larger inducer; its compressor housings are bored to suit. */
const largerInducer = (f: FrameSeed) => Math.round(f.inducerMm * 1.05);

function frameParts(b: Builder, f: FrameSeed, index: number) {
  const trim = trimPct(f.inducerMm, f.exducerMm);
  const sizeFactor = 1 + index * 0.42;
  const turboBase = 640 * sizeFactor ** 1.25;
  const line = `${HOUSE_BRAND} ${f.name} (${f.code})`;
  const wheelText = `${f.inducerMm} mm inducer, ${f.exducerMm} mm exducer compressor wheel (${trim} trim)`;
  const shaftText = `rated to ${f.maxShaftRpm.toLocaleString('en-US')} rpm`;
  const bandText = `for about ${f.powerBandHp[0]}–${f.powerBandHp[1]} hp`;
  const wastegate = index <= 4 ? 'internal' : 'external';
  const turbineMaterial = index >= 6 ? 'cast stainless steel' : 'cast iron';
  const turbineInlet = flangeInletMm(f.flangePattern);
  const coolingOf = (bearing: 'journal' | 'ball') => (bearing === 'ball' || index >= 3 ? 'oil and water' : 'oil');
  const cooledText = (cooling: string) => (cooling === 'oil' ? 'Oil cooled' : 'Oil and water cooled');

  for (const bearing of f.bearingOptions) {
    const bearingText = bearing === 'ball' ? 'ball bearing' : 'journal bearing';
    const bearingFactor = bearing === 'ball' ? 1.38 : 1;
    const cooling = coolingOf(bearing);
    // Complete turbochargers, new and on exchange, one per turbine A/R.
    f.turbineArOptions.forEach((tar, i) => {
      const car = f.compressorArOptions[Math.min(i, f.compressorArOptions.length - 1)] ?? 0.5;
      const specs: SpecSeed = {
        compressorAr: car,
        turbineAr: tar,
        trimPct: trim,
        inducerMm: f.inducerMm,
        exducerMm: f.exducerMm,
        flangePattern: f.flangePattern,
        inletMm: f.compressorInletMm,
        outletMm: f.compressorOutletMm,
        material: turbineMaterial,
        bearing,
        wastegate,
        cooling,
      };
      const newPrice = roundPrice(turboBase * bearingFactor * (1 + i * 0.04));
      const number = nextNumber(b, f.code, 'turbochargers');
      add(b, {
        partNumber: number,
        title: `${line} turbocharger, ${bearingText}, ${tar.toFixed(2)} A/R turbine`,
        category: 'turbochargers',
        frameCode: f.code,
        priceCents: newPrice,
        weightGrams: Math.round(f.weightKg * 1000),
        description: `New complete turbocharger ${bandText}. ${wheelText}, ${shaftText}. ${tar.toFixed(2)} A/R ${turbineMaterial} turbine housing with ${f.flangePattern} inlet flange and ${wastegate} wastegate; ${car.toFixed(2)} A/R compressor housing. ${cooledText(cooling)} centre housing.`,
        minStock: index >= 7 ? 1 : 3,
        specs,
      });
      add(b, {
        partNumber: `${number}-${EXCHANGE_SUFFIX}`,
        title: `${line} turbocharger, ${bearingText}, ${tar.toFixed(2)} A/R turbine (exchange unit)`,
        category: 'turbochargers',
        frameCode: f.code,
        condition: 'exchange',
        priceCents: roundPrice((newPrice / 100) * 0.68),
        coreDepositCents: Math.round((newPrice * 0.22) / 1000) * 1000,
        weightGrams: Math.round(f.weightKg * 1000),
        description: `Remanufactured on exchange ${bandText}: new bearings, seals and a balanced rotating assembly in an inspected housing. A refundable core deposit is charged until your old unit comes back in rebuildable condition. ${wheelText}.`,
        minStock: 1,
        specs,
      });
    });

    // Cartridges: two trims per bearing type (the standard wheel and a larger-trim option).
    for (const [k, inducer] of [f.inducerMm, largerInducer(f)].entries()) {
      const cartTrim = trimPct(inducer, f.exducerMm);
      add(b, {
        partNumber: nextNumber(b, f.code, 'cartridges'),
        title: `${line} cartridge, ${bearingText}, ${cartTrim} trim`,
        category: 'cartridges',
        frameCode: f.code,
        priceCents: roundPrice(turboBase * bearingFactor * 0.46 * (1 + k * 0.06)),
        weightGrams: Math.round(f.weightKg * 1000 * 0.38),
        description: `Balanced centre housing and rotating assembly: shaft and turbine wheel, ${inducer} mm inducer / ${f.exducerMm} mm exducer compressor wheel, ${bearingText}s, seals. ${cooledText(cooling)}, ${shaftText}. Fits ${f.code} compressor housings bored for the ${inducer} mm inducer, and every ${f.code} turbine housing.`,
        specs: { trimPct: cartTrim, inducerMm: inducer, exducerMm: f.exducerMm, bearing, cooling, material: 'forged aluminium compressor wheel, cast nickel-alloy turbine wheel' },
      });
    }
  }

  // Compressor housings: cast aluminium, by A/R and by the inducer bore of the wheel they take.
  for (const car of f.compressorArOptions) {
    for (const [k, inducer] of [f.inducerMm, largerInducer(f)].entries()) {
      add(b, {
        partNumber: nextNumber(b, f.code, 'compressor-housings'),
        title: `${f.code} compressor housing ${car.toFixed(2)} A/R, ${inducer} mm inducer bore, ${f.compressorInletMm} mm inlet`,
        category: 'compressor-housings',
        frameCode: f.code,
        priceCents: roundPrice(140 * sizeFactor ** 1.1 + k * 30),
        weightGrams: Math.round(f.weightKg * 1000 * 0.18),
        description: `Cast aluminium compressor housing with its adapter (diffuser) plate, ${car.toFixed(2)} A/R, bored for a ${inducer} mm inducer (${trimPct(inducer, f.exducerMm)} trim ${f.code} cartridges), ${f.compressorInletMm} mm inlet, ${f.compressorOutletMm} mm outlet. Clocks in 8 positions.`,
        specs: {
          compressorAr: car,
          inducerMm: inducer,
          exducerMm: f.exducerMm,
          trimPct: trimPct(inducer, f.exducerMm),
          inletMm: f.compressorInletMm,
          outletMm: f.compressorOutletMm,
          material: 'cast aluminium',
          mounting: 'clamp ring, 8 clocking positions',
        },
      });
    }
  }

  // Turbine housings: cast iron or cast stainless steel, by A/R; the inlet is the frame's flange.
  const inletJoint = isVBand(f.flangePattern) ? `${f.flangePattern} clamp` : `${f.flangePattern} flange`;
  for (const tar of turbineHousingArs(f)) {
    for (const material of ['cast iron', 'cast stainless steel']) {
      const steel = material !== 'cast iron';
      add(b, {
        partNumber: nextNumber(b, f.code, 'turbine-housings'),
        title: `${f.code} turbine housing ${tar.toFixed(2)} A/R, ${f.flangePattern} inlet, ${material}`,
        category: 'turbine-housings',
        frameCode: f.code,
        priceCents: roundPrice(220 * sizeFactor ** 1.15 * (steel ? 1.65 : 1)),
        weightGrams: Math.round(f.weightKg * 1000 * 0.42),
        description: `${material === 'cast iron' ? 'Cast iron (high-silicon-molybdenum)' : 'Cast austenitic stainless steel'} turbine housing, ${tar.toFixed(2)} A/R, ${turbineInlet} mm inlet with ${inletJoint}, ${wastegate} wastegate. ${steel ? 'For sustained exhaust temperatures above 950 °C.' : 'For exhaust temperatures up to about 950 °C.'}`,
        specs: {
          turbineAr: tar,
          flangePattern: f.flangePattern,
          material,
          wastegate,
          inletMm: turbineInlet,
          outletMm: Math.round(f.turbineWheelMm * 1.15),
          mounting: 'V-band outlet, 6 clocking positions',
        },
      });
    }
  }

  // Gaskets and fittings for this frame.
  const g = (title: string, description: string, specs: SpecSeed, dollars: number, grams: number, prefix = f.code, frameCode: string | null = f.code) => {
    const number = nextNumber(b, prefix, 'gaskets-fittings');
    return add(b, { partNumber: number, title, category: 'gaskets-fittings', frameCode, priceCents: roundPrice(dollars), weightGrams: grams, description, minStock: 10, specs });
  };
  const feed = index <= 3 ? '-4 AN' : '-6 AN';
  // One inlet sealing part per flange pattern, shared by every frame that uses the pattern.
  const sharing = FRAMES.filter((x) => x.flangePattern === f.flangePattern);
  if (sharing[0] === f) {
    const codes = sharing.map((x) => x.code).join(' and ');
    const frameCode = sharing.length > 1 ? null : f.code;
    const prefix = sharing.length > 1 ? SHARED_FLANGE_PREFIX : f.code;
    if (isVBand(f.flangePattern)) {
      g(`${f.flangePattern} turbine inlet clamp and sealing ring`, `Stainless V-band clamp with a metal sealing ring for the ${f.flangePattern} turbine inlet of ${codes} housings. V-band joints seal metal to metal: no flat gasket.`, { flangePattern: f.flangePattern, material: 'stainless steel', connection: 'V-band' }, 44 + index * 4, 260 + index * 20, prefix, frameCode);
    } else {
      g(`${f.flangePattern} turbine inlet gasket`, `Multi-layer steel gasket for the ${f.flangePattern} turbine inlet of ${codes} housings.`, { flangePattern: f.flangePattern, material: 'multi-layer stainless steel' }, 14 + index * 2, 60 + index * 12, prefix, frameCode);
    }
  }
  g(`${f.code} oil drain gasket`, `Oil drain flange gasket for ${f.code} centre housings.`, { material: 'fibre-reinforced composite', connection: 'drain flange' }, 7 + index, 20);
  g(`${f.code} gasket and seal kit`, `All gaskets, O-rings and washers for fitting a ${f.code} turbocharger.`, { flangePattern: f.flangePattern, material: 'steel, composite, fluoroelastomer' }, 38 + index * 4, 180);
  g(`${f.code} oil feed line ${feed}, 600 mm`, `Stainless braided PTFE oil feed line with a restrictor port, for ${f.code} journal and ball bearing centre housings.`, { material: 'stainless braided PTFE', connection: feed }, 62 + index * 4, 320);
  g(`${f.code} oil drain line -10 AN`, `Large-bore oil drain line, for a free gravity drain to the sump above oil level.`, { material: 'rubber hose, steel fittings', connection: '-10 AN' }, 48 + index * 3, 450);
  g(`${f.code} compressor outlet coupler ${f.compressorOutletMm} mm`, `Four-ply silicone hose coupler for the ${f.compressorOutletMm} mm compressor outlet, with two T-bolt clamps.`, { material: 'silicone, stainless clamps', inletMm: f.compressorOutletMm, outletMm: f.compressorOutletMm }, 29 + index * 2, 180);
  g(`${f.code} turbine outlet V-band clamp`, `Stainless V-band clamp for the ${f.code} turbine housing outlet.`, { material: 'stainless steel', connection: 'V-band' }, 34 + index * 3, 240);
  g(`${f.code} oil feed restrictor ${index <= 3 ? '1.0' : '1.5'} mm`, `Restrictor fitting for the oil feed. Ball bearing cartridges need a restricted feed; follow the fitting instructions.`, { material: 'brass', connection: feed }, 18 + index, 30);
  g(`${f.code} water line kit`, `Coolant feed and return lines for water-cooled ${f.code} centre housings.`, { material: 'stainless braided hose', connection: 'M14×1.5 banjo' }, 74 + index * 3, 520);
}

function gaugeParts(b: Builder) {
  const gauge = (type: string, title: string, range: string, mounting: string, dollars: number, grams: number, description: string, connection: string) =>
    add(b, {
      partNumber: nextNumber(b, INSTRUMENT_PREFIX, 'gauges-sensors'),
      title,
      category: 'gauges-sensors',
      frameCode: null,
      priceCents: roundPrice(dollars),
      weightGrams: grams,
      description,
      minStock: 4,
      specs: { gaugeType: type, rangeText: range, mounting, connection },
    });
  for (const size of [52, 60]) {
    gauge('boost', `Boost gauge ${size} mm, −1 to 2 bar`, '−1 to 2 bar', `${size} mm dash pod`, 96 + size - 52, 220, 'Electronic boost and vacuum gauge with its own manifold pressure sensor.', '1/8 NPT sensor');
    gauge('boost', `Boost gauge ${size} mm, −1 to 3.5 bar`, '−1 to 3.5 bar', `${size} mm dash pod`, 104 + size - 52, 220, 'Electronic boost gauge for higher boost, peak recall.', '1/8 NPT sensor');
    gauge('boost', `Boost gauge ${size} mm, −30 inHg to 35 psi`, '−30 inHg to 35 psi', `${size} mm dash pod`, 99 + size - 52, 220, 'Imperial-scale electronic boost and vacuum gauge.', '1/8 NPT sensor');
    gauge('egt', `Exhaust gas temperature gauge ${size} mm, 0–1100 °C`, '0–1100 °C', `${size} mm dash pod`, 139 + size - 52, 260, 'EGT gauge with a type K thermocouple probe for the turbine inlet.', 'type K probe, 1/8 NPT');
    gauge('oil-pressure', `Oil pressure gauge ${size} mm, 0–10 bar`, '0–10 bar', `${size} mm dash pod`, 92 + size - 52, 210, 'Electronic oil pressure gauge; check the turbo oil feed on first start.', '1/8 NPT sensor');
  }
  gauge('egt', 'EGT thermocouple probe, type K, exposed tip', '0–1250 °C', 'compression fitting', 58, 60, 'Fast-response replacement probe for exhaust gas temperature gauges and loggers.', '1/8 NPT');
  gauge('oil-pressure', 'Oil pressure sender 0–10 bar', '0–10 bar', 'threaded sender', 64, 90, 'Replacement pressure sender for the oil pressure gauges and loggers.', '1/8 NPT');
  gauge('boost', 'Manifold pressure sensor 4 bar absolute', '20–400 kPa absolute', 'threaded sensor', 79, 70, 'Absolute pressure sensor for boost gauges, loggers and engine control.', '1/8 NPT');
  // The same readings recorded on a plug-in logger for download after a run.
  gauge('boost', 'Boost logger, plug-in, −1 to 3.5 bar', '−1 to 3.5 bar', 'plug-in logger (USB download)', 189, 150, 'Records manifold pressure ten times a second on a plug-in logger, with its own sensor; download the run over USB.', '1/8 NPT sensor, USB');
  gauge('egt', 'Exhaust gas temperature logger, plug-in, 0–1250 °C', '0–1250 °C', 'plug-in logger (USB download)', 219, 170, 'Records exhaust gas temperature at the turbine inlet with a type K probe; download the run over USB.', 'type K probe, 1/8 NPT, USB');
  gauge('oil-pressure', 'Oil pressure logger, plug-in, 0–10 bar', '0–10 bar', 'plug-in logger (USB download)', 179, 150, 'Records oil pressure at the turbo feed with its own sender; download the run over USB.', '1/8 NPT sensor, USB');
  for (const [band, max] of [['small frames', 300000], ['large frames', 200000]] as const) {
    gauge('shaft-speed', `Shaft speed sensor kit, ${band}, dash gauge`, `0–${max.toLocaleString('en-US')} rpm`, '52 mm dash gauge', 329, 240, `Reads compressor wheel speed through the housing wall; shows rpm and peak on a dash gauge. For ${band}. Drilling the housing is needed: have it done by a qualified workshop.`, 'sensor boss M8');
    gauge('shaft-speed', `Shaft speed sensor kit, ${band}, plug-in logger`, `0–${max.toLocaleString('en-US')} rpm`, 'plug-in logger (USB download)', 389, 180, `Reads compressor wheel speed and records it on a plug-in logger for download after a run. For ${band}.`, 'sensor boss M8, USB');
  }
  // Fittings that the sensors need.
  gauge('egt', 'EGT probe weld bung 1/8 NPT, stainless', '—', 'weld-in bung', 16, 30, 'Stainless weld bung for an exhaust gas temperature probe in the manifold, ahead of the turbine.', '1/8 NPT');
  gauge('boost', 'Pressure sensor T-adaptor 1/8 NPT', '—', 'threaded adaptor', 19, 40, 'Brass T-adaptor to run a boost or oil pressure sensor beside an existing line.', '1/8 NPT');
  gauge('shaft-speed', 'Shaft speed sensor boss M8, for compressor housings', '—', 'threaded boss', 24, 20, 'Threaded boss for a shaft speed sensor in the compressor housing wall. Machining the housing is needed: have it done by a qualified workshop.', 'sensor boss M8');
}

function addSynthetic(b: Builder, target: number, random: () => number) {
  // Large catalogues for benchmarks: further product lines (1–9) of the same kinds of part, deterministic.
  const templates = b.parts.filter((p) => p.status === 'active');
  let i = 0;
  while (b.parts.length < target) {
    const t = templates[i % templates.length]!;
    i++;
    const from = parsePartNumber(t.partNumber)!;
    const line = 1 + Math.floor(random() * 9);
    const number = nextNumber(b, from.prefix, t.category as CategorySlug, line);
    add(b, {
      ...t,
      partNumber: from.exchange ? `${number}-${EXCHANGE_SUFFIX}` : number,
      title: `${t.title} — line ${line}${String.fromCharCode(65 + (i % 26))}`,
      priceCents: Math.max(99, Math.round(t.priceCents * (0.85 + random() * 0.3))),
      aliases: [],
      goesWith: [],
      stock: [],
      specs: { ...t.specs },
    });
  }
}

/** Parts that go together, both ways, between parts on sale only. */
function linkGoesWith(b: Builder) {
  const link = (a: PartSeed, c: PartSeed | undefined) => {
    if (!c || a === c || a.status !== 'active' || c.status !== 'active') return;
    if (!a.goesWith.includes(c.partNumber)) a.goesWith.push(c.partNumber);
    if (!c.goesWith.includes(a.partNumber)) c.goesWith.push(a.partNumber);
  };
  const onSale = b.parts.filter((p) => p.status === 'active');
  const find = (pred: (p: PartSeed) => boolean) => onSale.find(pred);
  const instruments = onSale.filter((p) => p.category === 'gauges-sensors');
  const instrument = (words: string) => instruments.find((s) => s.title.includes(words));

  FRAMES.forEach((f, index) => {
    const list = onSale.filter((p) => p.frameCode === f.code);
    const fitting = (words: string) => list.find((p) => p.category === 'gaskets-fittings' && p.title.includes(words));
    const inletSeal = find((p) => p.category === 'gaskets-fittings' && p.specs.flangePattern === f.flangePattern && p.title.includes('turbine inlet'));
    const kit = fitting('gasket and seal kit');
    const feed = fitting('oil feed line');
    const drain = fitting('oil drain line');
    const drainGasket = fitting('oil drain gasket');
    const water = fitting('water line kit');
    const restrictor = fitting('oil feed restrictor');
    const outletClamp = fitting('turbine outlet V-band clamp');
    const coupler = fitting('compressor outlet coupler');
    const speedSensor = instrument(index <= 4 ? 'small frames, dash' : 'large frames, dash');
    const speedLogger = instrument(index <= 4 ? 'small frames, plug-in' : 'large frames, plug-in');
    const compressorHousings = list.filter((p) => p.category === 'compressor-housings');
    const turbineHousings = list.filter((p) => p.category === 'turbine-housings');
    for (const p of list) {
      if (p.category === 'turbochargers' || p.category === 'cartridges') {
        link(p, kit);
        link(p, feed);
        link(p, drain);
        link(p, drainGasket);
        if (p.specs.cooling === 'oil and water') link(p, water);
        if (p.specs.bearing === 'ball') link(p, restrictor);
      }
      if (p.category === 'turbochargers') {
        link(p, inletSeal);
        link(p, outletClamp);
        link(p, coupler);
        link(p, speedSensor);
        link(p, speedLogger);
      } else if (p.category === 'cartridges') {
        // A cartridge fits the compressor housings bored for its inducer, and every turbine housing of the frame.
        compressorHousings.filter((h) => h.specs.inducerMm === p.specs.inducerMm).forEach((h) => link(p, h));
        turbineHousings.forEach((h) => link(p, h));
      } else if (p.category === 'turbine-housings') {
        link(p, inletSeal);
        link(p, outletClamp);
      } else if (p.category === 'compressor-housings') {
        link(p, coupler);
      }
    }
  });

  // Each sensor with the fittings it needs; a gauge's spare sender or probe.
  const bung = instrument('weld bung');
  const tee = instrument('T-adaptor');
  const boss = instrument('sensor boss');
  const probe = instrument('thermocouple probe');
  const sender = instrument('Oil pressure sender');
  const mapSensor = instrument('Manifold pressure sensor');
  for (const s of instruments) {
    if (s === bung || s === tee || s === boss || s === probe || s === sender || s === mapSensor) continue;
    if (s.specs.gaugeType === 'egt') {
      link(s, bung);
      link(s, probe);
    } else if (s.specs.gaugeType === 'boost') {
      link(s, tee);
      link(s, mapSensor);
    } else if (s.specs.gaugeType === 'oil-pressure') {
      link(s, tee);
      link(s, sender);
    } else if (s.specs.gaugeType === 'shaft-speed') {
      link(s, boss);
    }
  }
}

/**
 * A few parts are discontinued (sold out) and replaced by a revised part under a new, higher serial; the old
 * part's page points at the replacement, and nothing links to it any more.
 */
function discontinueWithReplacements(b: Builder) {
  const candidates = b.parts.filter((p) => p.status === 'active' && p.condition === 'new' && p.category !== 'turbochargers');
  candidates
    .filter((_p, i) => i % 53 === 17)
    .forEach((old) => {
      const from = parsePartNumber(old.partNumber)!;
      const revised = add(b, {
        ...old,
        partNumber: nextNumber(b, from.prefix, old.category as CategorySlug, from.line),
        description: `${old.description} Revised design; replaces ${old.partNumber}.`,
        aliases: [],
        goesWith: [],
        stock: [],
        specs: { ...old.specs },
      });
      old.status = 'discontinued';
      old.supersededBy = revised.partNumber;
      old.description = `Discontinued: replaced by ${revised.partNumber}. ${old.description}`;
    });
}

function addSupersessionsAndCrossRefs(b: Builder, random: () => number) {
  const active = b.parts.filter((p) => p.status === 'active');
  // Every 9th part replaced an older number (a lower serial); every 7th has a number from an invented interchange list.
  active.forEach((p, i) => {
    if (i % 9 === 4) {
      const from = parsePartNumber(p.partNumber)!;
      const earlier = formatPartNumber({ ...from, serial: from.serial - EARLIER_NUMBER_OFFSET });
      if (b.byNumber.has(earlier)) return;
      const oldPart = add(b, {
        ...p,
        partNumber: earlier,
        status: 'superseded',
        supersededBy: p.partNumber,
        title: `${p.title} (earlier number)`,
        description: `Replaced by ${p.partNumber}. ${p.description}`,
        aliases: [],
        goesWith: [],
        stock: [],
        specs: { ...p.specs },
      });
      p.aliases.push({ alias: oldPart.partNumber, kind: 'superseded', source: 'earlier number' });
    }
    if (i % 7 === 2) {
      const a = 100 + Math.floor(random() * 899);
      const c = 1000 + Math.floor(random() * 8999);
      p.aliases.push({ alias: `IX ${a}-${c}`, kind: 'cross-reference', source: 'trade interchange list' });
    }
  });
}

/**
 * Rebuild kits: one per cartridge family (frame and bearing), linked both ways with the cartridges and complete units
 * they rebuild. Added after the rest of the catalogue (and its synthetic lines) so the parts, stock and numbers before
 * them stay as they were.
 */
function addRebuildKits(b: Builder) {
  FRAMES.forEach((f, index) => {
    const sizeFactor = 1 + index * 0.42;
    const line = `${HOUSE_BRAND} ${f.name} (${f.code})`;
    for (const bearing of f.bearingOptions) {
      const journal = bearing === 'journal';
      const kit = add(b, {
        partNumber: nextNumber(b, f.code, 'rebuild-kits'),
        title: journal ? `${line} rebuild kit, journal bearing cartridges` : `${line} seal kit, ball bearing cartridges`,
        category: 'rebuild-kits',
        frameCode: f.code,
        priceCents: roundPrice((journal ? 96 : 64) * sizeFactor ** 1.1),
        weightGrams: Math.round((journal ? 180 : 90) * sizeFactor),
        description: journal
          ? `Everything that wears in a ${f.code} journal bearing cartridge, for one rebuild: two journal bearings, the thrust bearing and thrust collar, the piston rings for the compressor and turbine ends, and the O-rings. Rebuild on a clean bench, check shaft play against the workshop manual and balance the rotating assembly before it runs again; have it done by a qualified workshop.`
          : `Cartridge seals (piston rings for the compressor and turbine ends) and O-rings for a ${f.code} ball bearing cartridge, for one rebuild. The ball bearing cartridge itself is a separate part: replacing it whole rather than its balls and races is common practice. Balance the rotating assembly before it runs again; have it done by a qualified workshop.`,
        minStock: journal ? 4 : 3,
        specs: {
          bearing,
          material: journal ? 'journal bearings, thrust bearing and collar, piston rings, fluoroelastomer O-rings' : 'piston rings (cartridge seals), fluoroelastomer O-rings',
        },
      });
      // Both ways: the kit lists what it rebuilds, and each cartridge and complete unit of the family lists its kit.
      for (const p of b.parts) {
        // The main range only: a large generated catalogue's further lines would give each kit thousands of links.
        if (p.status !== 'active' || p.frameCode !== f.code || p.specs.bearing !== bearing || parsePartNumber(p.partNumber)?.line !== 0) continue;
        if (p.category !== 'cartridges' && p.category !== 'turbochargers') continue;
        kit.goesWith.push(p.partNumber);
        p.goesWith.push(kit.partNumber);
      }
    }
  });
}

function assignStock(b: Builder, bins: BinSeed[], random: () => number) {
  // Heavy parts live in the last zones (near dispatch), small parts in the first.
  const heavyBins = bins.filter((x) => x.zone >= 'D');
  const lightBins = bins.filter((x) => x.zone < 'D');
  b.parts.forEach((p, i) => {
    if (p.status === 'superseded') return;
    const pool = p.weightGrams >= 4000 ? heavyBins : lightBins;
    const first = pool[Math.floor(random() * pool.length)]!;
    const roll = random();
    if (p.status === 'discontinued' || roll < 0.11) return; // out of stock
    const base = p.category === 'gaskets-fittings' ? 40 : p.category === 'gauges-sensors' ? 15 : p.weightGrams > 15000 ? 3 : 8;
    const qty = roll < 0.2 ? 1 : Math.max(1, Math.round(base * (0.3 + random())));
    p.stock.push({ binCode: first.code, onHand: qty });
    if (i % 5 === 0) {
      const second = pool[Math.floor(random() * pool.length)]!;
      if (second.code !== first.code) p.stock.push({ binCode: second.code, onHand: Math.max(1, Math.round(qty / 2)) });
    }
  });
}

export interface GenerateOptions {
  /** Total number of parts; above the demo catalogue's size, synthetic variants are added. */
  parts?: number;
  seed?: number;
}

export function generateCatalogue(options: GenerateOptions = {}): CatalogueSeed {
  const random = createRandom(options.seed ?? 20261201);
  const b: Builder = { parts: [], byNumber: new Map(), serial: new Map() };
  FRAMES.forEach((f, i) => frameParts(b, f, i));
  gaugeParts(b);
  discontinueWithReplacements(b);
  linkGoesWith(b);
  addSupersessionsAndCrossRefs(b, random);
  // The kits come last but count toward the size asked for.
  const kits = FRAMES.reduce((n, f) => n + f.bearingOptions.length, 0);
  if (options.parts && options.parts - kits > b.parts.length) addSynthetic(b, options.parts - kits, random);
  addRebuildKits(b);
  const bins = makeBins();
  assignStock(b, bins, random);
  return { frames: FRAMES, parts: b.parts, bins };
}

export function normalizedAliases(p: PartSeed) {
  return p.aliases.map((a) => ({ ...a, normalizedAlias: normalizePartNumber(a.alias) }));
}
