import { useEffect, useId, useState, type KeyboardEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import {
  catalogueLinkOf,
  clockAngle,
  clockingOf,
  clockWords,
  partsOfPiece,
  piecesOf,
  turbineJointOf,
  VIEWED_FROM,
  type ClockPosition,
  type Orientation,
  type Piece,
  type PieceId,
} from '../../../shared/exploded-view';

// Our own schematic drawing of a unit taken apart along its shaft: intake side on the left, exhaust on the right.
// Colours are the theme's: aluminium white, the centre section panel, cast iron cast-line; the piece in view temper.

export interface ExplodedFrame {
  code: string;
  name: string;
  inducerMm: number;
  exducerMm: number;
  turbineWheelMm: number;
  flangePattern: string;
}

export interface ExplodedPart {
  partNumber: string;
  title: string;
  category: string;
  frameCode: string | null;
}

export interface ExplodedViewProps {
  frame: ExplodedFrame;
  /** The frame's parts on sale (what the catalogue lists for it). */
  parts: readonly ExplodedPart[];
  /** The piece the page is about (a part page), shown highlighted and open until another is chosen. */
  highlight?: PieceId | null;
  /** The housings' positions to show; the frame's standard position when not given. */
  orientation?: Orientation | null;
  /** The heading level of the view's own title. */
  headingLevel?: 2 | 3;
}

const W = 1000;
const H = 400;
const AXIS = 200;
/** The range's smallest and largest exducers: a frame's drawing grows between them, so a bigger frame looks bigger. */
const SMALLEST_EXDUCER_MM = 41;
const LARGEST_EXDUCER_MM = 150;
const GAP = 30;

const r1 = (n: number) => Math.round(n * 10) / 10;

interface Geometry {
  /** Compressor wheel (exducer), inducer and turbine wheel radii in drawing units. */
  e: number;
  i: number;
  t: number;
  f: number;
  widths: Record<PieceId, number>;
}

function geometryOf(frame: ExplodedFrame): Geometry {
  // From 0.45 (the smallest frame) to 1 (the largest): not to true scale, so the smallest stays large enough to point at.
  const size = Math.min(1, Math.max(0, (frame.exducerMm - SMALLEST_EXDUCER_MM) / (LARGEST_EXDUCER_MM - SMALLEST_EXDUCER_MM)));
  const f = 0.45 + 0.55 * size;
  const perMm = (f * 80) / (frame.exducerMm / 2);
  const e = (frame.exducerMm / 2) * perMm;
  return {
    f,
    e,
    i: (frame.inducerMm / 2) * perMm,
    t: (frame.turbineWheelMm / 2) * perMm,
    widths: {
      'compressor-cover': 150 * f,
      'diffuser-plate': 14 * f,
      cartridge: 235 * f,
      gaskets: 8,
      'turbine-joint': 20 * f,
      'turbine-housing': 160 * f,
    },
  };
}

/** Drawing order along the shaft (the gaskets sit between cartridge and turbine side). */
const ALONG_SHAFT: PieceId[] = ['compressor-cover', 'diffuser-plate', 'cartridge', 'gaskets', 'turbine-joint', 'turbine-housing'];

function positions(g: Geometry, gap: number): Record<PieceId, number> {
  const total = ALONG_SHAFT.reduce((sum, id) => sum + g.widths[id], 0) + gap * (ALONG_SHAFT.length - 1);
  let x = (W - total) / 2;
  const at = {} as Record<PieceId, number>;
  for (const id of ALONG_SHAFT) {
    at[id] = x;
    x += g.widths[id] + gap;
  }
  return at;
}

/** A tube leaving a housing at a clock position, seen from the side: up at 12, down at 6, end on at 3 and 9. */
function SideTube({ x, y, r, length, position, className }: { x: number; y: number; r: number; length: number; position: ClockPosition; className: string }) {
  const rise = -Math.cos((clockAngle(position) * Math.PI) / 180);
  const end = r1(y + rise * length);
  if (Math.abs(rise) < 0.3) return <ellipse cx={x} cy={y} rx={r} ry={r * 0.9} className={className} />;
  return (
    <>
      <rect x={r1(x - r)} y={Math.min(y, end)} width={r1(2 * r)} height={r1(Math.abs(end - y))} className={className} />
      <ellipse cx={x} cy={end} rx={r} ry={r * 0.35} className={className} />
    </>
  );
}

function PieceShape({ id, x, g, frame, orientation }: { id: PieceId; x: number; g: Geometry; frame: ExplodedFrame; orientation: Orientation }): ReactNode {
  const { e, i, t, f, widths } = g;
  const w = widths[id];
  switch (id) {
    case 'compressor-cover': {
      const inletW = 44 * f;
      const body = e * 1.75;
      return (
        <>
          <rect x={x} y={AXIS - i * 1.2} width={inletW + 4} height={i * 2.4} rx={3} className="fill-white" />
          <SideTube x={x + inletW + (w - inletW) * 0.45} y={AXIS} r={e * 0.42} length={body + 26 * f} position={orientation.compressorOutlet} className="fill-white" />
          <path
            d={`M${r1(x + inletW)} ${r1(AXIS - body)} H${r1(x + w - 10)} Q${r1(x + w)} ${r1(AXIS - body)} ${r1(x + w)} ${r1(AXIS - body + 10)} V${r1(AXIS + body - 10)} Q${r1(x + w)} ${r1(AXIS + body)} ${r1(x + w - 10)} ${r1(AXIS + body)} H${r1(x + inletW)} Q${r1(x + inletW - 14 * f)} ${AXIS} ${r1(x + inletW)} ${r1(AXIS - body)} Z`}
            className="fill-white"
          />
          <path d={`M${r1(x + inletW + 18 * f)} ${r1(AXIS - body + 8)} Q${r1(x + inletW + 4)} ${AXIS} ${r1(x + inletW + 18 * f)} ${r1(AXIS + body - 8)}`} className="stroke-cast" strokeWidth={1.5} fill="none" />
        </>
      );
    }
    case 'diffuser-plate':
      return <rect x={x} y={AXIS - e * 1.45} width={w} height={e * 2.9} rx={2} className="fill-white" />;
    case 'cartridge': {
      const wheel = 44 * f;
      const hx = x + wheel + 8 * f;
      const hw = w - 2 * wheel - 16 * f;
      const hh = e * 0.95;
      return (
        <>
          <path d={`M${r1(x - 4)} ${AXIS} H${r1(x + w + 4)}`} strokeWidth={4} />
          <rect x={x} y={AXIS - 7} width={8 * f} height={14} rx={1.5} className="fill-white" />
          <path d={`M${r1(x + 8 * f)} ${r1(AXIS - i)} L${r1(x + wheel)} ${r1(AXIS - e)} V${r1(AXIS + e)} L${r1(x + 8 * f)} ${r1(AXIS + i)} Z`} className="fill-white" />
          <rect x={hx} y={AXIS - hh} width={hw} height={hh * 2} rx={8} className="fill-panel" />
          {/* Oil in on top, drain below: they stay there whatever the housings' clocking. */}
          <rect x={hx + hw * 0.4} y={AXIS - hh - 14 * f} width={hw * 0.2} height={14 * f} className="fill-panel" />
          <rect x={hx + hw * 0.32} y={AXIS + hh} width={hw * 0.36} height={16 * f} className="fill-panel" />
          {/* Bearings (two) and seal rings at each end. */}
          {[0.22, 0.68].map((p) => (
            <rect key={p} x={hx + hw * p} y={AXIS - 16} width={hw * 0.1} height={32} rx={2} className="fill-white stroke-cast" strokeWidth={1.5} />
          ))}
          {[0.06, 0.9].map((p) => (
            <path key={p} d={`M${r1(hx + hw * p)} ${AXIS - 11} V${AXIS + 11} M${r1(hx + hw * p + 5)} ${AXIS - 11} V${AXIS + 11}`} className="stroke-cast" strokeWidth={1.5} />
          ))}
          <path d={`M${r1(x + w - wheel)} ${r1(AXIS - t)} L${r1(x + w)} ${r1(AXIS - t * 0.7)} V${r1(AXIS + t * 0.7)} L${r1(x + w - wheel)} ${r1(AXIS + t)} Z`} className="fill-cast-line" />
        </>
      );
    }
    case 'gaskets':
      return (
        <>
          <rect x={x} y={AXIS - t * 1.35} width={w} height={t * 2.7} rx={2} className="fill-white" strokeDasharray="6 3" />
          <path d={`M${x} ${AXIS - t * 0.8} h${w} M${x} ${AXIS + t * 0.8} h${w}`} className="stroke-cast" strokeWidth={1.5} />
        </>
      );
    case 'turbine-joint':
      return turbineJointOf(frame) === 'clamp' ? (
        <path
          d={`M${r1(x)} ${r1(AXIS - t * 1.6)} L${r1(x + w / 2)} ${r1(AXIS - t * 1.6 + 10)} L${r1(x + w)} ${r1(AXIS - t * 1.6)} V${r1(AXIS + t * 1.6)} L${r1(x + w / 2)} ${r1(AXIS + t * 1.6 - 10)} L${r1(x)} ${r1(AXIS + t * 1.6)} Z`}
          className="fill-white"
        />
      ) : (
        <>
          {[-1.3, -0.45, 0.45, 1.3].map((p) => (
            <g key={p}>
              <rect x={x} y={AXIS + p * t - 7} width={w * 0.45} height={14} rx={1.5} className="fill-white" />
              <rect x={x + w * 0.45} y={AXIS + p * t - 3} width={w * 0.55} height={6} className="fill-white" />
            </g>
          ))}
        </>
      );
    case 'turbine-housing': {
      const bodyW = w - 36 * f;
      const body = t * 1.9;
      return (
        <>
          <SideTube x={x + bodyW * 0.5} y={AXIS} r={t * 0.6} length={body + 24 * f} position={orientation.turbineInlet} className="fill-cast-line" />
          <path
            d={`M${x} ${r1(AXIS - body * 0.8)} Q${x} ${r1(AXIS - body)} ${r1(x + 14)} ${r1(AXIS - body)} H${r1(x + bodyW - 14)} Q${r1(x + bodyW)} ${r1(AXIS - body)} ${r1(x + bodyW)} ${r1(AXIS - body * 0.6)} V${r1(AXIS + body * 0.6)} Q${r1(x + bodyW)} ${r1(AXIS + body)} ${r1(x + bodyW - 14)} ${r1(AXIS + body)} H${r1(x + 14)} Q${x} ${r1(AXIS + body)} ${x} ${r1(AXIS + body * 0.8)} Z`}
            className="fill-cast-line"
          />
          <rect x={x + bodyW} y={AXIS - t * 0.95} width={w - bodyW} height={t * 1.9} rx={3} className="fill-cast-line" />
        </>
      );
    }
  }
}

/** Where a piece's highlight and focus ring go. */
function boxOf(id: PieceId, x: number, g: Geometry) {
  const half = { 'compressor-cover': g.e * 1.75 + 28 * g.f, 'diffuser-plate': g.e * 1.45, cartridge: g.e * 0.95 + 18 * g.f, gaskets: g.t * 1.35, 'turbine-joint': g.t * 1.6, 'turbine-housing': g.t * 1.9 + 26 * g.f }[id];
  const pad = 6;
  return { x: r1(x - pad), y: r1(Math.max(4, AXIS - half - pad)), width: r1(g.widths[id] + 2 * pad), height: r1(Math.min(H - 8, 2 * half + 2 * pad)) };
}

function ClockDial({ title, offered, chosen, standard }: { title: string; offered: readonly ClockPosition[]; chosen: ClockPosition; standard: ClockPosition }) {
  const c = 70;
  const point = (deg: number, r: number) => [r1(c + r * Math.sin((deg * Math.PI) / 180)), r1(c - r * Math.cos((deg * Math.PI) / 180))] as const;
  const [ax, ay] = point(clockAngle(chosen), 40);
  return (
    <figure className="grid justify-items-center gap-1">
      <svg viewBox="0 0 140 140" className="w-32 stroke-ink sm:w-36" aria-hidden="true" focusable="false" fill="none" strokeWidth={2}>
        <circle cx={c} cy={c} r={52} className="fill-white" />
        {Array.from({ length: 12 }, (_, h) => {
          const [x0, y0] = point(h * 30, 47);
          const [x1, y1] = point(h * 30, 52);
          return <path key={h} d={`M${x0} ${y0} L${x1} ${y1}`} className="stroke-cast" strokeWidth={1.5} />;
        })}
        {offered.map((p) => {
          const [x, y] = point(clockAngle(p), 60);
          return <circle key={p} cx={x} cy={y} r={p === chosen ? 6 : 3.5} className={p === chosen ? 'fill-temper stroke-temper' : 'fill-white stroke-cast'} strokeWidth={1.5} />;
        })}
        <path d={`M${c} ${c} L${ax} ${ay}`} className="stroke-temper" strokeWidth={5} strokeLinecap="round" />
        <circle cx={c} cy={c} r={6} className="fill-panel" />
      </svg>
      <figcaption className="text-center text-sm">
        <span className="font-semibold">{title}</span>
        <br />
        <span className="tabular">
          {clockWords(chosen)}
          {chosen === standard ? ' (standard)' : ''}
        </span>
      </figcaption>
    </figure>
  );
}

function partsWord(n: number) {
  return n === 1 ? '1 part' : `${n} parts`;
}

/**
 * The frame's unit taken apart along its shaft. Each piece is a button: pointing at it or focusing it highlights it,
 * choosing it lists the frame's parts for that piece with links. A list of the pieces below does the same in text.
 */
export function ExplodedView({ frame, parts, highlight = null, orientation, headingLevel = 2 }: ExplodedViewProps) {
  const uid = useId();
  const panelId = `${uid}-panel`;
  const pieces = piecesOf(frame);
  const clocking = clockingOf(frame);
  const shown = orientation ?? clocking.standard;
  const g = geometryOf(frame);
  const [chosen, setChosen] = useState<PieceId | null>(highlight);
  const [pointed, setPointed] = useState<PieceId | null>(null);
  const [focused, setFocused] = useState<PieceId | null>(null);
  // Drawn together first, then taken apart; without motion (prefers-reduced-motion) the pieces simply appear apart.
  const [apart, setApart] = useState(false);
  useEffect(() => {
    const id = requestAnimationFrame(() => setApart(true));
    return () => cancelAnimationFrame(id);
  }, []);
  useEffect(() => setChosen(highlight), [highlight]);

  const lit = pointed ?? focused ?? chosen;
  const open = pieces.find((p) => p.id === chosen) ?? null;
  const exploded = positions(g, GAP);
  const together = positions(g, 0);
  const partsOf = (piece: Piece) => partsOfPiece(piece, frame.code, parts);
  const units = parts.filter((p) => p.frameCode === frame.code && p.category === 'turbochargers').length;
  const Heading = `h${headingLevel}` as const;
  const Sub = `h${headingLevel + 1}` as 'h3' | 'h4';

  const choose = (id: PieceId) => setChosen(id);
  const onKey = (id: PieceId) => (e: KeyboardEvent) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      choose(id);
    }
  };
  const label = (piece: Piece) => {
    const n = partsOf(piece).length;
    return `${piece.name}: ${piece.categories.length === 0 ? 'not sold separately' : n === 0 ? 'none on sale' : partsWord(n)}`;
  };

  return (
    <section aria-labelledby={`${uid}-title`} className="grid gap-3" data-exploded-view={frame.code}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Heading id={`${uid}-title`} className="text-xl font-bold">
          Exploded view, frame <span className="part-no">{frame.code}</span> {frame.name}
        </Heading>
        <button type="button" className="min-h-10 rounded-md px-2 font-semibold text-temper underline" onClick={() => setApart((a) => !a)}>
          {apart ? 'Show it put together' : 'Take it apart'}
        </button>
      </div>
      <p className="text-sm text-cast">
        Intake side on the left, exhaust on the right; larger frames are drawn larger ({frame.exducerMm} mm compressor wheel, {frame.turbineWheelMm} mm turbine wheel).
        Point at or choose a piece to see its parts.
      </p>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="group"
        aria-label={`Pieces of frame ${frame.code}, taken apart along the shaft`}
        className="block h-auto w-full rounded-md bg-paper stroke-ink ring-1 ring-cast-line"
        fill="none"
        strokeWidth={2.5}
        strokeLinejoin="round"
      >
        <path d={`M20 ${AXIS} H${W - 20}`} className="stroke-cast" strokeWidth={1} strokeDasharray="9 3 2 3" />
        {ALONG_SHAFT.map((id) => {
          const piece = pieces.find((p) => p.id === id)!;
          const x = exploded[id];
          const shift = apart ? 0 : together[id] - exploded[id];
          const box = boxOf(id, x, g);
          const isLit = lit === id;
          return (
            <g
              key={id}
              role="button"
              tabIndex={0}
              aria-label={label(piece)}
              aria-pressed={chosen === id}
              aria-controls={panelId}
              data-piece={id}
              data-lit={isLit ? 'true' : undefined}
              className={`cursor-pointer outline-none motion-safe:transition-transform motion-safe:duration-700 ${lit && !isLit ? 'opacity-45' : ''}`}
              style={{ transform: `translateX(${r1(shift)}px)` }}
              onClick={() => choose(id)}
              onKeyDown={onKey(id)}
              onPointerEnter={() => setPointed(id)}
              onPointerLeave={() => setPointed((p) => (p === id ? null : p))}
              onFocus={() => setFocused(id)}
              onBlur={() => setFocused((f) => (f === id ? null : f))}
            >
              <rect {...box} rx={8} className={isLit ? 'fill-temper-tint stroke-temper' : 'fill-transparent stroke-none'} strokeWidth={focused === id ? 4 : 2} strokeDasharray={focused === id ? '8 4' : undefined} />
              <g className={isLit ? 'stroke-temper' : undefined}>
                <PieceShape id={id} x={x} g={g} frame={frame} orientation={shown} />
              </g>
            </g>
          );
        })}
        <text x={24} y={H - 16} className="fill-cast stroke-none text-[22px]">
          intake
        </text>
        <text x={W - 24} y={H - 16} textAnchor="end" className="fill-cast stroke-none text-[22px]">
          exhaust
        </text>
      </svg>

      <div className="grid gap-4 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="grid content-start gap-2">
          <Sub className="font-bold">Pieces</Sub>
          <ul className="grid gap-1" aria-label={`Pieces of frame ${frame.code}`}>
            {pieces.map((piece) => (
              <li key={piece.id}>
                <button
                  type="button"
                  aria-pressed={chosen === piece.id}
                  aria-controls={panelId}
                  onClick={() => choose(piece.id)}
                  onPointerEnter={() => setPointed(piece.id)}
                  onPointerLeave={() => setPointed((p) => (p === piece.id ? null : p))}
                  onFocus={() => setFocused(piece.id)}
                  onBlur={() => setFocused((f) => (f === piece.id ? null : f))}
                  className={`grid min-h-11 w-full rounded-md px-3 py-1 text-left ring-1 ${lit === piece.id ? 'bg-temper-tint ring-temper' : 'bg-white ring-cast-line'}`}
                >
                  <span className="font-semibold">{label(piece)}</span>
                  <span className="text-sm text-cast">{piece.what}</span>
                </button>
              </li>
            ))}
          </ul>
          {units > 0 && (
            <p className="text-sm">
              The whole unit:{' '}
              <Link to={`/catalogue?frame=${encodeURIComponent(frame.code)}&category=turbochargers`} className="font-semibold text-temper underline">
                complete turbochargers of {frame.code} ({units})
              </Link>
            </p>
          )}
        </div>
        <div id={panelId} aria-live="polite" className="grid content-start gap-2 rounded-md bg-white p-3 ring-1 ring-cast-line">
          {open ? <PiecePanel piece={open} frameCode={frame.code} parts={partsOf(open)} Sub={Sub} /> : <p className="text-cast">Choose a piece in the drawing or the list to see the parts of frame {frame.code} for it.</p>}
        </div>
      </div>

      <div className="grid gap-2">
        <Sub className="font-bold">Clocked positions, {VIEWED_FROM}</Sub>
        <div className="flex flex-wrap gap-6">
          <ClockDial title="Compressor outlet" offered={clocking.compressorOutlet} chosen={shown.compressorOutlet} standard={clocking.standard.compressorOutlet} />
          <ClockDial title="Turbine inlet" offered={clocking.turbineInlet} chosen={shown.turbineInlet} standard={clocking.standard.turbineInlet} />
        </div>
        <p className="text-sm text-cast">
          The compressor cover clocks in {clocking.compressorOutlet.length} positions ({clocking.compressorOutlet.map(clockWords).join(', ')}); the turbine housing in{' '}
          {clocking.turbineInlet.length} ({clocking.turbineInlet.map(clockWords).join(', ')}). The oil inlet stays on top and the drain at the bottom whatever the housings&rsquo;
          positions. Standard: compressor outlet {clockWords(clocking.standard.compressorOutlet)}, turbine inlet {clockWords(clocking.standard.turbineInlet)}.
        </p>
      </div>
    </section>
  );
}

function PiecePanel({ piece, frameCode, parts, Sub }: { piece: Piece; frameCode: string; parts: ExplodedPart[]; Sub: 'h3' | 'h4' }) {
  const link = catalogueLinkOf(piece, frameCode);
  return (
    <>
      <Sub className="font-bold">
        {piece.name}, frame <span className="part-no">{frameCode}</span>
      </Sub>
      <p className="text-sm text-cast">{piece.what}</p>
      {parts.length === 0 ? (
        <p>{piece.noPartsText}</p>
      ) : (
        <>
          <ul className="grid max-h-72 gap-1 overflow-y-auto" aria-label={`${piece.name} parts of frame ${frameCode}`}>
            {parts.map((p) => (
              <li key={p.partNumber}>
                <Link to={`/parts/${encodeURIComponent(p.partNumber)}`} className="text-temper underline">
                  <span className="part-no">{p.partNumber}</span>
                </Link>{' '}
                <span className="text-sm">{p.title}</span>
              </li>
            ))}
          </ul>
          {link && (
            <Link to={link} className="font-semibold text-temper underline">
              See these {parts.length} in the catalogue
            </Link>
          )}
        </>
      )}
    </>
  );
}

export default ExplodedView;
