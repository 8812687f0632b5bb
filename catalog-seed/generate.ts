import { normalizePartNumber } from '../shared/part-number';
import { trimPct } from '../shared/catalog';
import { FRAMES, HOUSE_BRAND, type FrameSeed, maxShaftRpmFor } from './frames';

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
const frameDigits = (f: FrameSeed) => f.code.slice(2);

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

function nextNumber(b: Builder, prefix: string, start: number): string {
  const n = (b.serial.get(prefix) ?? start) + 1;
  b.serial.set(prefix, n);
  return `${prefix}-${String(n).padStart(4, '0')}`;
}

function add(b: Builder, part: Omit<PartSeed, 'aliases' | 'goesWith' | 'stock' | 'status' | 'supersededBy' | 'minStock' | 'coreDepositCents' | 'condition'> & Partial<PartSeed>): PartSeed {
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
  };
  b.parts.push(full);
  b.byNumber.set(full.partNumber, full);
  return full;
}

function frameParts(b: Builder, f: FrameSeed, index: number) {
  const d = frameDigits(f);
  const trim = trimPct(f.inducerMm, f.exducerMm);
  const sizeFactor = 1 + index * 0.42;
  const turboBase = 640 * sizeFactor ** 1.25;
  const line = `${HOUSE_BRAND} ${f.name} ${f.code}`;
  const wheelText = `${f.inducerMm} mm inducer, ${f.exducerMm} mm exducer compressor wheel (${trim} trim)`;
  const shaftText = `rated to ${maxShaftRpmFor(f.exducerMm).toLocaleString('en-US')} rpm`;
  const bandText = `for about ${f.powerBandHp[0]}–${f.powerBandHp[1]} hp`;
  const wastegate = index <= 4 ? 'internal' : 'external';
  const turbineMaterial = index >= 6 ? 'cast stainless steel' : 'cast iron';

  for (const bearing of f.bearingOptions) {
    const bearingText = bearing === 'ball' ? 'ball bearing' : 'journal bearing';
    const bearingFactor = bearing === 'ball' ? 1.38 : 1;
    const cooling = bearing === 'ball' || index >= 3 ? 'oil and water' : 'oil';
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
      const number = nextNumber(b, `VC-T${d}`, 1000);
      add(b, {
        partNumber: number,
        title: `${line} turbocharger, ${bearingText}, ${tar.toFixed(2)} A/R turbine`,
        category: 'turbochargers',
        frameCode: f.code,
        priceCents: newPrice,
        weightGrams: Math.round(f.weightKg * 1000),
        description: `New complete turbocharger ${bandText}. ${wheelText}, ${shaftText}. ${tar.toFixed(2)} A/R ${turbineMaterial} turbine housing with ${f.flangePattern} inlet flange and ${wastegate} wastegate; ${car.toFixed(2)} A/R compressor housing. ${cooling === 'oil' ? 'Oil cooled' : 'Oil and water cooled'} centre housing.`,
        minStock: index >= 7 ? 1 : 3,
        specs,
      });
      add(b, {
        partNumber: `${number}X`,
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
    for (const [k, inducer] of [f.inducerMm, Math.round(f.inducerMm * 1.05)].entries()) {
      const cartTrim = trimPct(inducer, f.exducerMm);
      add(b, {
        partNumber: nextNumber(b, `VC-C${d}`, 2000),
        title: `${line} cartridge, ${bearingText}, ${cartTrim} trim`,
        category: 'cartridges',
        frameCode: f.code,
        priceCents: roundPrice(turboBase * bearingFactor * 0.46 * (1 + k * 0.06)),
        weightGrams: Math.round(f.weightKg * 1000 * 0.38),
        description: `Balanced centre housing and rotating assembly: shaft and turbine wheel, ${inducer} mm inducer / ${f.exducerMm} mm exducer compressor wheel, ${bearingText}s, seals. ${cooling === 'oil' ? 'Oil cooled' : 'Oil and water cooled'}, ${shaftText}. Fits all ${f.code} housings.`,
        specs: { trimPct: cartTrim, inducerMm: inducer, exducerMm: f.exducerMm, bearing, cooling, material: 'forged aluminium compressor wheel, cast nickel-alloy turbine wheel' },
      });
    }
  }

  // Compressor housings: cast aluminium, by A/R and inlet size.
  for (const car of f.compressorArOptions) {
    for (const inlet of [f.compressorInletMm, Math.round(f.compressorInletMm * 1.2)]) {
      add(b, {
        partNumber: nextNumber(b, `VC-H${d}`, 3000),
        title: `${f.code} compressor housing ${car.toFixed(2)} A/R, ${inlet} mm inlet`,
        category: 'compressor-housings',
        frameCode: f.code,
        priceCents: roundPrice(140 * sizeFactor ** 1.1 + (inlet > f.compressorInletMm ? 30 : 0)),
        weightGrams: Math.round(f.weightKg * 1000 * 0.18),
        description: `Cast aluminium compressor housing for ${f.code} cartridges, ${car.toFixed(2)} A/R, ${inlet} mm inlet, ${f.compressorOutletMm} mm outlet. Clocks in 8 positions.`,
        specs: { compressorAr: car, inletMm: inlet, outletMm: f.compressorOutletMm, material: 'cast aluminium', mounting: 'clamp ring, 8 clocking positions' },
      });
    }
  }

  // Turbine housings: cast iron or cast stainless steel, by A/R and flange.
  for (const tar of [...f.turbineArOptions, Math.round((f.turbineArOptions.at(-1) ?? 1) * 1.15 * 100) / 100]) {
    for (const material of ['cast iron', 'cast stainless steel']) {
      const steel = material !== 'cast iron';
      add(b, {
        partNumber: nextNumber(b, `VC-W${d}`, 4000),
        title: `${f.code} turbine housing ${tar.toFixed(2)} A/R, ${f.flangePattern}, ${material}`,
        category: 'turbine-housings',
        frameCode: f.code,
        priceCents: roundPrice((220 * sizeFactor ** 1.15) * (steel ? 1.65 : 1)),
        weightGrams: Math.round(f.weightKg * 1000 * 0.42),
        description: `${material === 'cast iron' ? 'Cast iron (high-silicon-molybdenum)' : 'Cast austenitic stainless steel'} turbine housing, ${tar.toFixed(2)} A/R, ${f.flangePattern} inlet, ${wastegate} wastegate. ${steel ? 'For sustained exhaust temperatures above 950 °C.' : 'For exhaust temperatures up to about 950 °C.'}`,
        specs: { turbineAr: tar, flangePattern: f.flangePattern, material, wastegate, inletMm: Math.round(f.turbineWheelMm * 0.9), outletMm: Math.round(f.turbineWheelMm * 1.15), mounting: 'V-band outlet, 6 clocking positions' },
      });
    }
  }

  // Gaskets and fittings for this frame.
  const g = (title: string, description: string, specs: SpecSeed, dollars: number, grams: number) =>
    add(b, {
      partNumber: nextNumber(b, `VC-G${d}`, 5000),
      title,
      category: 'gaskets-fittings',
      frameCode: f.code,
      priceCents: roundPrice(dollars),
      weightGrams: grams,
      description,
      minStock: 10,
      specs,
    });
  const feed = index <= 3 ? '-4 AN' : '-6 AN';
  g(`${f.flangePattern} turbine inlet gasket`, `Multi-layer steel gasket for the ${f.flangePattern} turbine inlet of ${f.code} housings.`, { flangePattern: f.flangePattern, material: 'multi-layer stainless steel' }, 14 + index * 2, 60 + index * 12);
  g(`${f.code} oil drain gasket`, `Oil drain flange gasket for ${f.code} centre housings.`, { material: 'fibre-reinforced composite', connection: 'drain flange' }, 7 + index, 20);
  g(`${f.code} gasket and seal kit`, `All gaskets, O-rings and washers for fitting a ${f.code} turbocharger.`, { flangePattern: f.flangePattern, material: 'steel, composite, fluoroelastomer' }, 38 + index * 4, 180);
  g(`${f.code} oil feed line ${feed}, 600 mm`, `Stainless braided PTFE oil feed line with restrictor port for ${f.code} ${index <= 3 ? 'journal and ball' : ''} bearing centre housings.`, { material: 'stainless braided PTFE', connection: feed }, 62 + index * 4, 320);
  g(`${f.code} oil drain line -10 AN`, `Large-bore oil drain line, for a free gravity drain to the sump above oil level.`, { material: 'rubber hose, steel fittings', connection: '-10 AN' }, 48 + index * 3, 450);
  g(`${f.code} compressor outlet coupler ${f.compressorOutletMm} mm`, `Four-ply silicone hose coupler for the ${f.compressorOutletMm} mm compressor outlet, with two T-bolt clamps.`, { material: 'silicone, stainless clamps', inletMm: f.compressorOutletMm, outletMm: f.compressorOutletMm }, 29 + index * 2, 180);
  g(`${f.code} turbine outlet V-band clamp`, `Stainless V-band clamp for the ${f.code} turbine housing outlet.`, { material: 'stainless steel', connection: 'V-band' }, 34 + index * 3, 240);
  g(`${f.code} oil feed restrictor ${index <= 3 ? '1.0' : '1.5'} mm`, `Restrictor fitting for the oil feed. Ball bearing cartridges need a restricted feed; follow the fitting instructions.`, { material: 'brass', connection: feed }, 18 + index, 30);
  g(`${f.code} water line kit`, `Coolant feed and return lines for water-cooled ${f.code} centre housings.`, { material: 'stainless braided hose', connection: 'M14×1.5 banjo' }, 74 + index * 3, 520);
}

function gaugeParts(b: Builder) {
  const gauge = (type: string, title: string, range: string, mounting: string, dollars: number, grams: number, description: string, connection: string) =>
    add(b, {
      partNumber: nextNumber(b, 'VC-S', 6000),
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
  gauge('egt', 'EGT thermocouple probe, type K, exposed tip', '0–1250 °C', 'compression fitting', 58, 60, 'Fast-response replacement probe for exhaust gas temperature gauges.', '1/8 NPT');
  gauge('oil-pressure', 'Oil pressure sender 0–10 bar', '0–10 bar', 'threaded sender', 64, 90, 'Replacement pressure sender for the oil pressure gauges.', '1/8 NPT');
  gauge('boost', 'Manifold pressure sensor 4 bar absolute', '20–400 kPa absolute', 'threaded sensor', 79, 70, 'Absolute pressure sensor for boost gauges and engine control.', '1/8 NPT');
  for (const [band, max] of [['small frames', 300000], ['large frames', 200000]] as const) {
    gauge('shaft-speed', `Shaft speed sensor kit, ${band}, dash gauge`, `0–${max.toLocaleString('en-US')} rpm`, '52 mm dash gauge', 329, 240, `Reads compressor wheel speed through the housing wall; shows rpm and peak on a dash gauge. For ${band}. Drilling the housing is needed: have it done by a qualified workshop.`, 'sensor boss M8');
    gauge('shaft-speed', `Shaft speed sensor kit, ${band}, plug-in logger`, `0–${max.toLocaleString('en-US')} rpm`, 'plug-in logger (USB download)', 389, 180, `Reads compressor wheel speed and records it on a plug-in logger for download after a run. For ${band}.`, 'sensor boss M8, USB');
  }
}

function addSynthetic(b: Builder, target: number, random: () => number) {
  // Large catalogues for benchmarks: more variants of the same kinds of part, deterministic.
  const templates = b.parts.filter((p) => p.status === 'active');
  let i = 0;
  while (b.parts.length < target) {
    const t = templates[i % templates.length]!;
    i++;
    const prefix = t.partNumber.replace(/-\d+X?$/, '');
    const variant = 1 + Math.floor(random() * 9);
    add(b, {
      ...t,
      partNumber: nextNumber(b, `${prefix}${variant}`, 0),
      title: `${t.title} — variant ${variant}${String.fromCharCode(65 + (i % 26))}`,
      priceCents: Math.max(99, Math.round(t.priceCents * (0.85 + random() * 0.3))),
      aliases: [],
      goesWith: [],
      stock: [],
      specs: { ...t.specs },
    });
  }
}

function linkGoesWith(b: Builder) {
  const byFrame = new Map<string, PartSeed[]>();
  for (const p of b.parts) {
    if (!p.frameCode || p.status !== 'active') continue;
    const list = byFrame.get(p.frameCode) ?? [];
    list.push(p);
    byFrame.set(p.frameCode, list);
  }
  const link = (a: PartSeed, c: PartSeed | undefined) => {
    if (!c || a === c) return;
    if (!a.goesWith.includes(c.partNumber)) a.goesWith.push(c.partNumber);
    if (!c.goesWith.includes(a.partNumber)) c.goesWith.push(a.partNumber);
  };
  const sensors = b.parts.filter((p) => p.category === 'gauges-sensors');
  const sensorFor = (frame: string) =>
    sensors.find((s) => s.title.includes(FRAMES.findIndex((f) => f.code === frame) <= 4 ? 'small frames, dash' : 'large frames, dash'));
  for (const [frame, list] of byFrame) {
    const gaskets = list.filter((p) => p.category === 'gaskets-fittings').slice(0, 6);
    const byTitle = (s: string) => gaskets.find((p) => p.title.includes(s));
    const inlet = byTitle('turbine inlet gasket');
    const kit = byTitle('gasket and seal kit');
    const feed = byTitle('oil feed line');
    const drain = byTitle('oil drain line');
    const water = byTitle('water line kit');
    const comp = list.filter((p) => p.category === 'compressor-housings').slice(0, 2);
    const turb = list.filter((p) => p.category === 'turbine-housings').slice(0, 2);
    for (const p of list) {
      if (p.category === 'turbochargers') {
        link(p, kit);
        link(p, feed);
        link(p, drain);
        if (p.specs.cooling === 'oil and water') link(p, water);
        link(p, sensorFor(frame));
      } else if (p.category === 'cartridges') {
        comp.forEach((c) => link(p, c));
        turb.forEach((c) => link(p, c));
        link(p, kit);
      } else if (p.category === 'turbine-housings') {
        link(p, inlet);
      }
    }
  }
}

function addSupersessionsAndCrossRefs(b: Builder, random: () => number) {
  const active = b.parts.filter((p) => p.status === 'active');
  // Every 9th part replaced an older number; every 7th has a number from an invented interchange list.
  active.forEach((p, i) => {
    if (i % 9 === 4) {
      const old = `${p.partNumber.replace(/^VC-/, 'VC-').replace(/(\d{4})(X?)$/, (_m, n: string, x: string) => `${String(Number(n) + 500).padStart(4, '0')}${x}`)}`;
      if (b.byNumber.has(old)) return;
      const oldPart = add(b, {
        ...p,
        partNumber: old,
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
  // A few discontinued parts, kept for their history.
  active.filter((_p, i) => i % 53 === 17).forEach((p) => {
    p.status = 'discontinued';
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
  linkGoesWith(b);
  addSupersessionsAndCrossRefs(b, random);
  if (options.parts && options.parts > b.parts.length) addSynthetic(b, options.parts, random);
  const bins = makeBins();
  assignStock(b, bins, random);
  return { frames: FRAMES, parts: b.parts, bins };
}

export function normalizedAliases(p: PartSeed) {
  return p.aliases.map((a) => ({ ...a, normalizedAlias: normalizePartNumber(a.alias) }));
}
