import { useId } from 'react';
import type { ShaftLogPoint } from '../../../../shared/schemas/shaft-logs';
import type { MapLayer, MapScale } from './compressor-map-chart';

/** How a logged point is drawn: the worse of its two flags decides, and each has its own shape as well as colour. */
export type MarkerKind = 'ok' | 'near-surge' | 'near-limit' | 'above-map' | 'surge' | 'overspeed';

export const MARKER_WORDS: Record<MarkerKind, string> = {
  ok: 'logged point, within the limits',
  'near-surge': 'near surge',
  'near-limit': 'near the shaft-speed limit',
  'above-map': 'above the map’s top pressure ratio',
  surge: 'in surge (left of the surge line)',
  overspeed: 'over the shaft-speed limit',
};

export function markerOf(p: Pick<ShaftLogPoint, 'speed' | 'surge'>): MarkerKind {
  if (p.speed === 'overspeed') return 'overspeed';
  if (p.surge === 'surge') return 'surge';
  if (p.surge === 'above-map') return 'above-map';
  if (p.speed === 'near-limit') return 'near-limit';
  if (p.surge === 'near-surge') return 'near-surge';
  return 'ok';
}

/** Words for both of a point's flags, for tables. */
export function flagWords(p: Pick<ShaftLogPoint, 'speed' | 'surge'>): string {
  const words = [
    p.speed === 'overspeed' ? MARKER_WORDS.overspeed : p.speed === 'near-limit' ? MARKER_WORDS['near-limit'] : null,
    p.surge === 'surge' ? 'in surge' : p.surge === 'near-surge' ? MARKER_WORDS['near-surge'] : p.surge === 'above-map' ? MARKER_WORDS['above-map'] : null,
  ].filter(Boolean);
  return words.length > 0 ? words.join('; ') : 'within the limits';
}

const SEVERE = 'fill-oxide stroke-white';
const NEAR = 'fill-white stroke-amber-line';

/** One marker centred on (cx, cy); `size` is its half-width. Triangles point up (too fast), diamonds mark surge. */
export function Marker({ kind, cx, cy, size = 5 }: { kind: MarkerKind; cx: number; cy: number; size?: number }) {
  const s = size;
  switch (kind) {
    case 'overspeed':
    case 'near-limit':
      return (
        <path
          d={`M${cx},${cy - s * 1.15} L${cx + s},${cy + s * 0.75} L${cx - s},${cy + s * 0.75} Z`}
          className={kind === 'overspeed' ? SEVERE : NEAR}
          strokeWidth={kind === 'overspeed' ? 1.25 : 2}
          strokeLinejoin="round"
        />
      );
    case 'surge':
    case 'near-surge':
      return (
        <path
          d={`M${cx},${cy - s} L${cx + s},${cy} L${cx},${cy + s} L${cx - s},${cy} Z`}
          className={kind === 'surge' ? SEVERE : NEAR}
          strokeWidth={kind === 'surge' ? 1.25 : 2}
          strokeLinejoin="round"
        />
      );
    case 'above-map':
      return <rect x={cx - s * 0.8} y={cy - s * 0.8} width={s * 1.6} height={s * 1.6} className={SEVERE} strokeWidth={1.25} />;
    default:
      return <circle cx={cx} cy={cy} r={s * 0.5} className="fill-ink" fillOpacity={0.45} />;
  }
}

/** A marker as a small inline picture beside its words (keys, tables). */
export function MarkerIcon({ kind }: { kind: MarkerKind }) {
  return (
    <svg aria-hidden width="16" height="16" viewBox="0 0 16 16" className="inline-block shrink-0 align-[-3px]">
      <Marker kind={kind} cx={8} cy={8.5} size={kind === 'ok' ? 8 : 6} />
    </svg>
  );
}

/** Enough dots to show where the engine ran; every flagged point is always drawn. */
const MAX_PLAIN_DOTS = 1500;

function MeasuredPoints({ points, scale }: { points: readonly ShaftLogPoint[]; scale: MapScale }) {
  const id = useId();
  const onMap = points.filter((p) => p.pressureRatio >= 1);
  const plain = onMap.filter((p) => markerOf(p) === 'ok');
  const every = Math.max(1, Math.ceil(plain.length / MAX_PLAIN_DOTS));
  const flagged = onMap.filter((p) => markerOf(p) !== 'ok');
  // Severe markers last, so they sit on top of the near ones.
  const order: MarkerKind[] = ['near-surge', 'near-limit', 'above-map', 'surge', 'overspeed'];
  flagged.sort((a, b) => order.indexOf(markerOf(a)) - order.indexOf(markerOf(b)));
  const trace = onMap.filter((p, i) => i % every === 0 || markerOf(p) !== 'ok');
  const { plot } = scale;
  return (
    <g data-series="measured" data-points={onMap.length}>
      <defs>
        <clipPath id={`${id}-clip`}>
          <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} />
        </clipPath>
      </defs>
      <g clipPath={`url(#${id}-clip)`}>
        <polyline
          points={trace.map((p) => `${scale.x(p.correctedFlowLbMin).toFixed(1)},${scale.y(p.pressureRatio).toFixed(1)}`).join(' ')}
          fill="none"
          className="stroke-cast"
          strokeOpacity={0.35}
          strokeWidth={0.75}
        />
        {plain
          .filter((_, i) => i % every === 0)
          .map((p) => (
            <Marker key={p.t} kind="ok" cx={scale.x(p.correctedFlowLbMin)} cy={scale.y(p.pressureRatio)} size={scale.narrow ? 4 : 5} />
          ))}
        {flagged.map((p) => (
          <g key={p.t} data-state={markerOf(p)}>
            <Marker kind={markerOf(p)} cx={scale.x(p.correctedFlowLbMin)} cy={scale.y(p.pressureRatio)} size={scale.narrow ? 4.5 : 5.5} />
          </g>
        ))}
      </g>
    </g>
  );
}

/** The logged points as a layer over the compressor map chart. */
export function measuredLayer(points: readonly ShaftLogPoint[]): MapLayer {
  return {
    extent: points.filter((p) => p.pressureRatio >= 1).map((p) => ({ flowLbMin: p.correctedFlowLbMin, pressureRatio: p.pressureRatio })),
    render: (scale) => <MeasuredPoints points={points} scale={scale} />,
  };
}

/** The key to the logged points, shape and word for each state that the log has. */
export function MeasuredKey({ points }: { points: readonly ShaftLogPoint[] }) {
  const present = new Set(points.filter((p) => p.pressureRatio >= 1).map(markerOf));
  const kinds: MarkerKind[] = ['ok', 'near-surge', 'surge', 'near-limit', 'overspeed', 'above-map'];
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Key to the logged points">
      {kinds
        .filter((k) => k === 'ok' || present.has(k))
        .map((k) => (
          <li key={k} className="flex items-center gap-2">
            <MarkerIcon kind={k} />
            {MARKER_WORDS[k]}
          </li>
        ))}
    </ul>
  );
}
