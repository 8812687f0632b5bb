import { useId, useLayoutEffect, useRef, useState, type ReactNode } from 'react';
import type { MapPoint } from '../../../../shared/schemas/compressor-map';
import type { CandidatePoint, FitmentCandidate, MapZone, OperatingPoint } from '../../../../shared/schemas/fitment';
import type { FitmentFrameMap } from '../../../../shared/schemas/saved-fitments';
import { show, type UnitSystem } from '../lib/units';

const M = { left: 62, right: 20, top: 16, bottom: 54 };

/** The drawing is laid out at the width it is shown at, so its text stays readable on a phone. */
function useWidth<T extends HTMLElement>(fallback: number) {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.clientWidth || fallback);
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.round(entry.contentRect.width) || fallback);
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [fallback]);
  return [ref, width] as const;
}

const ZONE_WORDS: Record<MapZone, string> = {
  inside: 'on the map',
  surge: 'left of surge',
  choke: 'past choke',
  overspeed: 'over the shaft-speed limit',
  'above-max-pr': 'above the top pressure ratio',
  'below-map': 'below the lowest speed line',
};

/** Ticks at 1, 2, 2.5 or 5 × 10ⁿ from `min`, between `fewest` and `most` of them, ending as little past `max` as can be. */
export function niceTicks(min: number, max: number, fewest = 4, most = 8): number[] {
  const span = max - min;
  let best: { step: number; n: number } | null = null;
  for (let power = 10 ** Math.floor(Math.log10(span / most)) / 10; power <= span; power *= 10) {
    for (const m of [1, 2, 2.5, 5]) {
      const step = m * power;
      const n = Math.ceil(span / step - 1e-9);
      if (n < fewest || n > most) continue;
      if (!best || step * n < best.step * best.n - 1e-9) best = { step, n };
    }
  }
  const { step, n } = best ?? { step: span / fewest, n: fewest };
  return Array.from({ length: n + 1 }, (_, i) => Number((min + i * step).toPrecision(12)));
}

/** Decimal places that show every tick of this step exactly (0.25 → 2, 5 → 0). */
const decimalsOf = (step: number) => [0, 1, 2, 3].find((d) => Math.abs(step * 10 ** d - Math.round(step * 10 ** d)) < 1e-6) ?? 3;

/** The chart's scales, from corrected lb/min and pressure ratio to the drawing, for a layer drawn over the map. */
export interface MapScale {
  x: (lbMin: number) => number;
  y: (pr: number) => number;
  plot: { left: number; top: number; width: number; height: number };
  narrow: boolean;
}

/** A further series over the map: the points it spans, so the axes reach them, and how it draws itself. */
export interface MapLayer {
  extent: MapPoint[];
  render: (scale: MapScale) => ReactNode;
}

export interface CompressorMapChartProps {
  frame: FitmentFrameMap;
  line: OperatingPoint[];
  candidate: FitmentCandidate | undefined;
  system: UnitSystem;
  layer?: MapLayer;
  /**
   * Draw the candidate's own points instead of `line`: per unit (a twin's compressor sees half the air), from the
   * boost threshold, with the spool segment (wastegate shut) drawn apart from the boost segment.
   */
  candidateLine?: boolean;
}

/** One point of the line drawn: the engine's line with its zones looked up on the candidate, or the candidate's own. */
interface DrawnPoint {
  rpm: number;
  correctedFlowLbMin: number;
  pressureRatio: number;
  /** Only a candidate's own line has segments. */
  segment: CandidatePoint['segment'] | null;
  zone: MapZone;
  boostPsi: number | null;
  shaftRpm: number | null;
  shaftSpeedPct: number | null;
  efficiency: number | null;
}

const SEGMENT_WORDS: Record<CandidatePoint['segment'], string> = {
  spool: 'spool: boost building, wastegate shut',
  boost: 'boost held by the wastegate',
};

/** A spool point is a square, a boost point a circle; filled on the map, open (red oxide ring) off it. */
function SegmentMarker({ segment, inside, cx, cy }: { segment: CandidatePoint['segment']; inside: boolean; cx: number; cy: number }) {
  const className = inside ? (segment === 'spool' ? 'fill-temper-tint stroke-temper' : 'fill-temper stroke-white') : 'fill-white stroke-oxide';
  const strokeWidth = inside ? (segment === 'spool' ? 2 : 1.5) : 2.5;
  return segment === 'spool' ? (
    <rect x={cx - 4.5} y={cy - 4.5} width={9} height={9} className={className} strokeWidth={strokeWidth} />
  ) : (
    <circle cx={cx} cy={cy} r={5} className={className} strokeWidth={strokeWidth} />
  );
}

/** The frame's compressor map with the engine's operating line on it, drawn as plain SVG. */
export function CompressorMapChart({ frame, line, candidate, system, layer, candidateLine = false }: CompressorMapChartProps) {
  const id = useId();
  const [boxRef, boxWidth] = useWidth<HTMLDivElement>(720);
  const W = Math.max(300, Math.min(boxWidth, 960));
  const narrow = W < 520;
  const H = Math.round(narrow ? W * 0.95 : W * 0.64);
  const PLOT_W = W - M.left - M.right;
  const PLOT_H = H - M.top - M.bottom;
  const { map } = frame;
  const fx = (lbMin: number) => show.flowValue(lbMin, system);
  const zoneAt = new Map(candidate?.points.map((p) => [p.rpm, p]) ?? []);
  const own = candidateLine && candidate && candidate.points.length > 0 ? candidate.points : null;
  const drawn: DrawnPoint[] = own
    ? own
    : line.map((p) => {
        const c = zoneAt.get(p.rpm);
        return {
          rpm: p.rpm,
          correctedFlowLbMin: p.correctedFlowLbMin,
          pressureRatio: p.pressureRatio,
          segment: null,
          zone: c?.zone ?? 'inside',
          boostPsi: p.boostPsi,
          shaftRpm: c?.shaftRpm ?? null,
          shaftSpeedPct: c?.shaftSpeedPct ?? null,
          efficiency: c?.efficiency ?? null,
        };
      });
  const twin = own !== null && candidate?.layout === 'twin';

  const allFlows = [...map.chokeLine, ...map.speedLines.flatMap((s) => s.points), ...drawn.map((p) => ({ flowLbMin: p.correctedFlowLbMin })), ...(layer?.extent ?? [])].map((p) => p.flowLbMin);
  const allPr = [map.maxPressureRatio, ...drawn.map((p) => p.pressureRatio), ...(layer?.extent.map((p) => p.pressureRatio) ?? [])];
  // Room on the right of the choke line for the speed-line labels.
  const xTicks = niceTicks(0, fx(Math.max(...allFlows) * 1.1), 4, narrow ? 6 : 10);
  const xMax = xTicks.at(-1) ?? 1;
  const yTicks = niceTicks(1, Math.max(...allPr) * 1.04, 4, narrow ? 7 : 10);
  const yMax = yTicks.at(-1) ?? 2;
  const x = (lbMin: number) => M.left + (fx(lbMin) / xMax) * PLOT_W;
  const y = (pr: number) => M.top + PLOT_H - ((pr - 1) / (yMax - 1)) * PLOT_H;
  const path = (points: MapPoint[], close = false) =>
    points.map((p, i) => `${i === 0 ? 'M' : 'L'}${x(p.flowLbMin).toFixed(1)},${y(p.pressureRatio).toFixed(1)}`).join(' ') + (close ? ' Z' : '');

  // rpm labels alternate above and below the line; where points crowd (a narrow screen), some go unlabelled, never the ends.
  const labelled = new Map<number, 'above' | 'below'>();
  {
    const minGap = 34;
    let lastX = Number.NEGATIVE_INFINITY;
    let lastRpm: number | null = null;
    drawn.forEach((p, i) => {
      const px = x(p.correctedFlowLbMin);
      const isLast = i === drawn.length - 1;
      if (px - lastX >= minGap / 2 || lastRpm === null) {
        labelled.set(p.rpm, labelled.size % 2 === 0 ? 'above' : 'below');
        lastX = px;
        lastRpm = p.rpm;
      } else if (isLast) {
        const side = labelled.get(lastRpm);
        labelled.delete(lastRpm);
        labelled.set(p.rpm, side ?? 'above');
      }
    });
  }
  // Island labels sit on each contour's right flank, level with its middle (nested islands then label side by side),
  // or lower or higher on the flank where the operating line's points or another label would cover it.
  const taken: Array<{ x: number; y: number; w: number; h: number }> = drawn.map((q) => ({ x: x(q.correctedFlowLbMin), y: y(q.pressureRatio), w: 30, h: 30 }));
  const islandLabels = map.efficiencyIslands.map((island) => {
    const prs = island.points.map((p) => p.pressureRatio);
    const [lo, hi] = [Math.min(...prs), Math.max(...prs)];
    const meanFlow = island.points.reduce((sum, p) => sum + p.flowLbMin, 0) / island.points.length;
    const right = island.points.filter((p) => p.flowLbMin >= meanFlow);
    const flank = right.length > 0 ? right : island.points;
    const nearest = (level: number) => flank.reduce((a, b) => (Math.abs(b.pressureRatio - level) < Math.abs(a.pressureRatio - level) ? b : a));
    const at = (p: MapPoint) => ({ x: x(p.flowLbMin), y: y(p.pressureRatio) });
    const clear = (c: { x: number; y: number }) => taken.every((t) => Math.abs(t.x - c.x) > t.w || Math.abs(t.y - c.y) > t.h);
    const options = [0.5, 0.3, 0.7, 0.15, 0.85, 0.05, 0.95].map((f) => at(nearest(lo + f * (hi - lo))));
    const spot = options.find(clear) ?? options[0]!;
    taken.push({ ...spot, w: 36, h: 17 });
    return { efficiency: island.efficiency, ...spot };
  });
  const offMap = drawn.filter((p) => p.zone !== 'inside');
  const first = drawn[0];
  const last = drawn.at(-1);
  const spool = drawn.filter((p) => p.segment === 'spool');
  const held = drawn.filter((p) => p.segment === 'boost');
  const fullBoost = held[0];
  const xStep = (xTicks[1] ?? 1) - (xTicks[0] ?? 0);
  const yStep = (yTicks[1] ?? 1.5) - (yTicks[0] ?? 1);

  // Speed-line labels sit at the choke end; ones that would overlap the label above are left out.
  let lastLabelY = Number.POSITIVE_INFINITY;
  const speedLabels = [...map.speedLines]
    .map((s) => ({ rpm: s.rpm, end: s.points[s.points.length - 1]! }))
    .filter((s) => {
      const ly = y(s.end.pressureRatio);
      if (lastLabelY - ly < 13) return false;
      lastLabelY = ly;
      return true;
    });

  const summary =
    first && last
      ? `Compressor map of frame ${frame.code} ${frame.name}: corrected flow from 0 to ${xMax} ${show.flowUnit(system)} across, pressure ratio from 1 to ${yMax.toFixed(1)} up. ` +
        `The engine's operating line${twin ? ', per unit of the twin (each takes half the air),' : ''} runs from ${show.flow(first.correctedFlowLbMin, system)} at a pressure ratio of ${first.pressureRatio.toFixed(2)} (${first.rpm} rpm) ` +
        `to ${show.flow(last.correctedFlowLbMin, system)} at ${last.pressureRatio.toFixed(2)} (${last.rpm} rpm). ` +
        (spool.length > 0 && fullBoost
          ? `Spool segment, square points on a dashed line: ${spool.length} points from ${spool[0]!.rpm} rpm while boost builds with the wastegate shut; boost is held from ${fullBoost.rpm} rpm, round points on a solid line. `
          : '') +
        (offMap.length === 0
          ? 'Every point lies on the map, between the surge and choke limits.'
          : `${offMap.length} of ${drawn.length} points lie off the map: ${offMap.map((p) => `${p.rpm} rpm ${ZONE_WORDS[p.zone]}`).join(', ')}.`)
      : `Compressor map of frame ${frame.code} ${frame.name}.`;

  return (
    <figure className="grid gap-3">
      <div ref={boxRef} className="w-full">
      <svg
        role="img"
        aria-labelledby={`${id}-title ${id}-desc`}
        viewBox={`0 0 ${W} ${H}`}
        width={W}
        height={H}
        className="block max-w-full rounded-md bg-white ring-1 ring-cast-line"
        data-testid="compressor-map"
      >
        <title id={`${id}-title`}>{`Compressor map, ${frame.code} ${frame.name}, with the engine's operating line${twin ? ' per unit' : ''}`}</title>
        <desc id={`${id}-desc`}>{summary}</desc>
        <defs>
          <clipPath id={`${id}-plot`}>
            <rect x={M.left} y={M.top} width={PLOT_W} height={PLOT_H} />
          </clipPath>
        </defs>

        <g className="stroke-panel" strokeWidth={1}>
          {xTicks.map((t) => (
            <line key={`gx${t}`} x1={M.left + (t / xMax) * PLOT_W} x2={M.left + (t / xMax) * PLOT_W} y1={M.top} y2={M.top + PLOT_H} />
          ))}
          {yTicks.map((t) => (
            <line key={`gy${t}`} x1={M.left} x2={M.left + PLOT_W} y1={y(t)} y2={y(t)} />
          ))}
        </g>

        <g clipPath={`url(#${id}-plot)`} fill="none">
          <g className="stroke-cast-line" strokeWidth={1.25} data-series="speed-lines">
            {map.speedLines.map((s) => (
              <path key={s.rpm} d={path(s.points)} />
            ))}
          </g>
          <g className="stroke-cast" strokeWidth={1} data-series="efficiency-islands">
            {map.efficiencyIslands.map((island) => (
              <path key={island.efficiency} d={path(island.points, true)} />
            ))}
          </g>
          <path d={path(map.surgeLine)} className="stroke-ink" strokeWidth={3.5} strokeLinecap="round" data-series="surge-line" />
          <path d={path(map.chokeLine)} className="stroke-ink" strokeWidth={2} strokeDasharray="7 5" data-series="choke-line" />
        </g>

        <g className="fill-cast stroke-white" fontSize={12} strokeWidth={3} paintOrder="stroke">
          {speedLabels.map((s) => (
            <text key={s.rpm} x={x(s.end.flowLbMin) + 6} y={y(s.end.pressureRatio) + 4}>
              {narrow ? `${Math.round(s.rpm / 1000)}k` : `${Math.round(s.rpm / 1000)}k rpm`}
            </text>
          ))}
        </g>
        <g fontSize={12} fontWeight={600}>
          {islandLabels.map((l) => (
            <g key={l.efficiency}>
              <rect x={l.x - 17} y={l.y - 8} width={34} height={15} rx={2} className="fill-white" />
              <text x={l.x} y={l.y + 4} textAnchor="middle" className="fill-cast">
                {`${Math.round(l.efficiency * 100)} %`}
              </text>
            </g>
          ))}
        </g>

        {layer?.render({ x, y, plot: { left: M.left, top: M.top, width: PLOT_W, height: PLOT_H }, narrow })}

        {own ? (
          <g data-series="operating-line" data-own="candidate">
            {spool.length > 0 && (
              <polyline
                // The spool segment runs on to the first held point, so the two read as one line in two styles.
                points={[...spool, ...(fullBoost ? [fullBoost] : [])].map((p) => `${x(p.correctedFlowLbMin).toFixed(1)},${y(p.pressureRatio).toFixed(1)}`).join(' ')}
                fill="none"
                className="stroke-temper"
                strokeWidth={2}
                strokeDasharray="4 5"
                strokeLinejoin="round"
                data-segment-line="spool"
              />
            )}
            <polyline
              points={held.map((p) => `${x(p.correctedFlowLbMin).toFixed(1)},${y(p.pressureRatio).toFixed(1)}`).join(' ')}
              fill="none"
              className="stroke-temper"
              strokeWidth={2.5}
              strokeLinejoin="round"
              data-segment-line="boost"
            />
            {drawn.map((p) => {
              const px = x(p.correctedFlowLbMin);
              const py = y(p.pressureRatio);
              const segment = p.segment ?? 'boost';
              return (
                <g key={p.rpm} data-rpm={p.rpm} data-zone={p.zone} data-segment={segment}>
                  <SegmentMarker segment={segment} inside={p.zone === 'inside'} cx={px} cy={py} />
                  {labelled.has(p.rpm) && (
                    <text x={px} y={labelled.get(p.rpm) === 'above' ? py - 11 : py + 21} textAnchor="middle" fontSize={13} fontWeight={700} className="fill-temper-deep stroke-white" strokeWidth={3} paintOrder="stroke">
                      {p.rpm}
                    </text>
                  )}
                </g>
              );
            })}
          </g>
        ) : (
        <g data-series="operating-line">
          <polyline
            points={line.map((p) => `${x(p.correctedFlowLbMin).toFixed(1)},${y(p.pressureRatio).toFixed(1)}`).join(' ')}
            fill="none"
            className="stroke-temper"
            strokeWidth={2.5}
            strokeLinejoin="round"
          />
          {line.map((p) => {
            const inside = (zoneAt.get(p.rpm)?.zone ?? 'inside') === 'inside';
            const px = x(p.correctedFlowLbMin);
            const py = y(p.pressureRatio);
            return (
              <g key={p.rpm} data-rpm={p.rpm} data-zone={zoneAt.get(p.rpm)?.zone ?? 'inside'}>
                <circle cx={px} cy={py} r={5} className={inside ? 'fill-temper stroke-white' : 'fill-white stroke-oxide'} strokeWidth={inside ? 1.5 : 2.5} />
                {labelled.has(p.rpm) && (
                  <text x={px} y={labelled.get(p.rpm) === 'above' ? py - 11 : py + 21} textAnchor="middle" fontSize={13} fontWeight={700} className="fill-temper-deep stroke-white" strokeWidth={3} paintOrder="stroke">
                    {p.rpm}
                  </text>
                )}
              </g>
            );
          })}
        </g>
        )}

        <g className="fill-ink" fontSize={13}>
          <line x1={M.left} x2={M.left + PLOT_W} y1={M.top + PLOT_H} y2={M.top + PLOT_H} className="stroke-ink" />
          <line x1={M.left} x2={M.left} y1={M.top} y2={M.top + PLOT_H} className="stroke-ink" />
          {xTicks.map((t) => (
            <g key={`tx${t}`}>
              <line x1={M.left + (t / xMax) * PLOT_W} x2={M.left + (t / xMax) * PLOT_W} y1={M.top + PLOT_H} y2={M.top + PLOT_H + 5} className="stroke-ink" />
              <text x={M.left + (t / xMax) * PLOT_W} y={M.top + PLOT_H + 19} textAnchor="middle" className="tabular">
                {t.toFixed(decimalsOf(xStep))}
              </text>
            </g>
          ))}
          {yTicks.map((t) => (
            <g key={`ty${t}`}>
              <line x1={M.left - 5} x2={M.left} y1={y(t)} y2={y(t)} className="stroke-ink" />
              <text x={M.left - 8} y={y(t) + 4} textAnchor="end" className="tabular">
                {t.toFixed(Math.max(1, decimalsOf(yStep)))}
              </text>
            </g>
          ))}
          <text x={M.left + PLOT_W / 2} y={H - 12} textAnchor="middle" fontWeight={600}>
            {narrow ? `Corrected air flow (${show.flowUnit(system)})` : `Corrected air flow (${show.flowUnit(system)}, at 15 °C and 101.3 kPa)`}
          </text>
          <text transform={`translate(16 ${M.top + PLOT_H / 2}) rotate(-90)`} textAnchor="middle" fontWeight={600}>
            {narrow ? 'Pressure ratio' : 'Pressure ratio (outlet ÷ inlet, absolute)'}
          </text>
        </g>
      </svg>
      </div>

      <figcaption>
        <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Key to the map">
          <li className="flex items-center gap-2">
            <svg aria-hidden width="28" height="10">
              <line x1="2" x2="26" y1="5" y2="5" className="stroke-ink" strokeWidth="3.5" strokeLinecap="round" />
            </svg>
            surge limit
          </li>
          <li className="flex items-center gap-2">
            <svg aria-hidden width="28" height="10">
              <line x1="1" x2="27" y1="5" y2="5" className="stroke-ink" strokeWidth="2" strokeDasharray="7 5" />
            </svg>
            choke limit
          </li>
          <li className="flex items-center gap-2">
            <svg aria-hidden width="28" height="10">
              <line x1="1" x2="27" y1="5" y2="5" className="stroke-cast-line" strokeWidth="1.5" />
            </svg>
            shaft speed lines
          </li>
          <li className="flex items-center gap-2">
            <svg aria-hidden width="28" height="12">
              <ellipse cx="14" cy="6" rx="12" ry="4.5" fill="none" className="stroke-cast" strokeWidth="1" />
            </svg>
            efficiency islands
          </li>
          {own ? (
            <>
              <li className="flex items-center gap-2">
                <svg aria-hidden width="28" height="12">
                  <line x1="1" x2="27" y1="6" y2="6" className="stroke-temper" strokeWidth="2" strokeDasharray="4 5" />
                  <rect x="9.5" y="1.5" width="9" height="9" className="fill-temper-tint stroke-temper" strokeWidth="2" />
                </svg>
                spool: boost building, wastegate shut (engine rpm)
              </li>
              <li className="flex items-center gap-2">
                <svg aria-hidden width="28" height="12">
                  <line x1="1" x2="27" y1="6" y2="6" className="stroke-temper" strokeWidth="2.5" />
                  <circle cx="14" cy="6" r="4" className="fill-temper" />
                </svg>
                boost held (engine rpm)
              </li>
            </>
          ) : (
            <li className="flex items-center gap-2">
              <svg aria-hidden width="28" height="12">
                <line x1="1" x2="27" y1="6" y2="6" className="stroke-temper" strokeWidth="2.5" />
                <circle cx="14" cy="6" r="4" className="fill-temper" />
              </svg>
              engine operating line (engine rpm)
            </li>
          )}
          <li className="flex items-center gap-2">
            <svg aria-hidden width="14" height="14">
              <circle cx="7" cy="7" r="4.5" className="fill-white stroke-oxide" strokeWidth="2.5" />
            </svg>
            {own && (
              <svg aria-hidden width="14" height="14">
                <rect x="2.5" y="2.5" width="9" height="9" className="fill-white stroke-oxide" strokeWidth="2.5" />
              </svg>
            )}
            open point: off the map
          </li>
        </ul>
        {twin && <p className="mt-1 text-sm text-cast">Per unit: each compressor of the twin takes half the engine’s air.</p>}
        <details className="mt-2">
          <summary className="cursor-pointer font-semibold text-temper">The operating line as a table</summary>
          <OperatingTable points={drawn} frameCode={frame.code} system={system} withSegments={own !== null} />
        </details>
      </figcaption>
    </figure>
  );
}

/**
 * The line as numbers: a table where there is room, and on a phone one short block per point (rpm, stage, pressure
 * ratio and where it sits on the map first; the rest beneath), so nothing scrolls sideways.
 */
function OperatingTable({ points, frameCode, system, withSegments }: { points: DrawnPoint[]; frameCode: string; system: UnitSystem; withSegments: boolean }) {
  const shaft = (p: DrawnPoint) => (p.shaftRpm != null ? `${Math.round(p.shaftRpm / 1000)}k rpm` : '—');
  const boost = (p: DrawnPoint) => (p.boostPsi != null ? show.boost(p.boostPsi, system) : '—');
  return (
    <div className="mt-2 min-w-0">
      <table className="hidden w-full border-collapse text-left text-sm sm:table">
        <caption className="sr-only">{`Operating points on frame ${frameCode}`}</caption>
        <thead>
          <tr className="border-b border-cast-line">
            <th scope="col" className="py-1 pr-3">Engine rpm</th>
            {withSegments && <th scope="col" className="py-1 pr-3">Stage</th>}
            <th scope="col" className="py-1 pr-3 text-right">Corrected flow</th>
            <th scope="col" className="py-1 pr-3 text-right">Pressure ratio</th>
            {withSegments && <th scope="col" className="py-1 pr-3 text-right">Boost</th>}
            <th scope="col" className="py-1 pr-3 text-right">Shaft speed</th>
            <th scope="col" className="py-1 pr-3 text-right">Efficiency</th>
            <th scope="col" className="py-1">On this frame</th>
          </tr>
        </thead>
        <tbody className="tabular">
          {points.map((p) => (
            <tr key={p.rpm} className="border-b border-cast-line/60" data-segment={p.segment ?? undefined}>
              <th scope="row" className="py-1 pr-3 font-semibold">{p.rpm}</th>
              {withSegments && <td className="py-1 pr-3 whitespace-nowrap">{p.segment === 'spool' ? 'spool' : 'boost held'}</td>}
              <td className="py-1 pr-3 text-right whitespace-nowrap">{show.flow(p.correctedFlowLbMin, system)}</td>
              <td className="py-1 pr-3 text-right">{p.pressureRatio.toFixed(2)}</td>
              {withSegments && <td className="py-1 pr-3 text-right whitespace-nowrap">{boost(p)}</td>}
              <td className="py-1 pr-3 text-right whitespace-nowrap">{shaft(p)}</td>
              <td className="py-1 pr-3 text-right">{p.efficiency != null ? show.pct(p.efficiency) : '—'}</td>
              <td className="py-1">{ZONE_WORDS[p.zone]}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <ol className="grid gap-2 sm:hidden" aria-label={`Operating points on frame ${frameCode}`}>
        {points.map((p) => (
          <li key={p.rpm} className="rounded-md bg-panel/60 px-3 py-2 text-sm" data-segment={p.segment ?? undefined}>
            <p className="tabular flex flex-wrap items-baseline gap-x-2">
              <span className="font-bold">{show.rpm(p.rpm)}</span>
              {p.segment && <span className="text-cast">{SEGMENT_WORDS[p.segment]}</span>}
            </p>
            <dl className="tabular grid grid-cols-[auto_1fr] gap-x-3">
              <dt className="text-cast">Pressure ratio</dt>
              <dd>
                {p.pressureRatio.toFixed(2)}
                {withSegments ? ` (${boost(p)})` : ''}
              </dd>
              <dt className="text-cast">On this frame</dt>
              <dd className={p.zone === 'inside' ? '' : 'font-semibold text-oxide'}>{ZONE_WORDS[p.zone]}</dd>
              <dt className="text-cast">Flow</dt>
              <dd>{show.flow(p.correctedFlowLbMin, system)}</dd>
              <dt className="text-cast">Shaft, efficiency</dt>
              <dd>
                {shaft(p)}, {p.efficiency != null ? show.pct(p.efficiency) : '—'}
              </dd>
            </dl>
          </li>
        ))}
      </ol>
    </div>
  );
}
