import type { ReactNode } from 'react';
import type { IllustrationKind } from '../../../shared/part-illustration';

// Our own schematic line drawings, one per kind of part, on a 120 × 120 grid. Colours come from the theme: ink
// lines, cast detail, aluminium parts light (white), the centre section panel, cast iron a shade darker (cast-line).

const round = (n: number) => Math.round(n * 10) / 10;
const at = (cx: number, cy: number, r: number, deg: number): [number, number] => [round(cx + r * Math.cos((deg * Math.PI) / 180)), round(cy + r * Math.sin((deg * Math.PI) / 180))];

/** Points of a spiral whose radius grows from r0 to r1 while the angle runs from a0 through sweep degrees. */
function spiral(cx: number, cy: number, r0: number, r1: number, a0: number, sweep: number): string {
  const steps = Math.ceil(Math.abs(sweep) / 6);
  const points: string[] = [];
  for (let i = 0; i <= steps; i++) {
    const t = i / steps;
    const [x, y] = at(cx, cy, r0 + (r1 - r0) * t, a0 + sweep * t);
    points.push(`${i === 0 ? 'M' : 'L'}${x} ${y}`);
  }
  return points.join(' ');
}

/** Lines from the centre outwards, evenly spaced: wheel blades seen end on. */
function blades(cx: number, cy: number, r0: number, r1: number, count: number, curl: number): string {
  const paths: string[] = [];
  for (let i = 0; i < count; i++) {
    const a = (360 / count) * i;
    const [x0, y0] = at(cx, cy, r0, a);
    const [xm, ym] = at(cx, cy, (r0 + r1) / 2, a + curl * 0.7);
    const [x1, y1] = at(cx, cy, r1, a + curl);
    paths.push(`M${x0} ${y0} Q${xm} ${ym} ${x1} ${y1}`);
  }
  return paths.join(' ');
}

const FINE = 1.5;
const CENTRE_LINE = '9 3 2 3';

function CentreLine({ x1, x2, y }: { x1: number; x2: number; y: number }) {
  return <path d={`M${x1} ${y} H${x2}`} className="stroke-cast" strokeWidth={1} strokeDasharray={CENTRE_LINE} />;
}

/** Hex nut or hex body seen from the side: an outline with the two visible flats. */
function HexSide({ x, y, w, h }: { x: number; y: number; w: number; h: number }) {
  return (
    <>
      <rect x={x} y={y} width={w} height={h} rx={1.5} className="fill-white" />
      <path d={`M${x} ${y + h * 0.28} H${x + w} M${x} ${y + h * 0.72} H${x + w}`} className="stroke-cast" strokeWidth={FINE} />
    </>
  );
}

/** External thread seen from the side: outline and slanted crests. */
function Thread({ x, y, w, h, pitch = 4 }: { x: number; y: number; w: number; h: number; pitch?: number }) {
  const crests: string[] = [];
  for (let cx = x + pitch / 2; cx < x + w; cx += pitch) crests.push(`M${round(cx)} ${y} L${round(cx - 2)} ${y + h}`);
  return (
    <>
      <rect x={x} y={y} width={w} height={h} rx={1} className="fill-white" />
      <path d={crests.join(' ')} className="stroke-cast" strokeWidth={FINE} />
    </>
  );
}

function Turbocharger() {
  return (
    <>
      {/* Compressor cover (aluminium) with its inlet to the left and outlet upwards. */}
      <rect x={8} y={46} width={24} height={32} rx={2} className="fill-white" />
      <rect x={12} y={43.5} width={4} height={37} rx={1} className="fill-white" />
      <rect x={37} y={6} width={15} height={14} rx={1.5} className="fill-white" />
      <path d="M35 10 H54" strokeWidth={FINE} />
      <path d="M56 18 H44 C36 18 30 24 30 34 V90 C30 100 36 106 44 106 H56 Z" className="fill-white" />
      <path d="M45 22 C38 34 38 90 45 102" className="stroke-cast" strokeWidth={FINE} />
      {/* Centre housing with the oil feed on top and the drain flange below. */}
      <rect x={56} y={26} width={4} height={72} rx={1} className="fill-panel" />
      <rect x={63} y={33} width={9} height={9} rx={1} className="fill-panel" />
      <rect x={61} y={82} width={13} height={9} rx={1} className="fill-panel" />
      <rect x={60} y={41} width={15} height={42} rx={3} className="fill-panel" />
      {/* Turbine housing (cast iron): exhaust out to the right, inlet flange at the foot. */}
      <rect x={81} y={94} width={15} height={10} className="fill-cast-line" />
      <rect x={77} y={103} width={23} height={7} rx={1} className="fill-cast-line" />
      <rect x={100} y={44} width={10} height={36} className="fill-cast-line" />
      <rect x={107} y={41} width={5} height={42} rx={1} className="fill-cast-line" />
      <path d="M75 28 H87 C96 28 102 34 102 44 V80 C102 90 96 96 87 96 H75 Z" className="fill-cast-line" />
      <path d="M86 32 C92 42 92 82 86 92" className="stroke-cast" strokeWidth={FINE} />
      <CentreLine x1={2} x2={118} y={62} />
    </>
  );
}

function Cartridge() {
  return (
    <>
      {/* Compressor wheel: inducer on the left, exducer against the back plate, nut on the nose. */}
      <rect x={9} y={57} width={7} height={10} rx={1} className="fill-white" />
      <path d="M16 40 C26 40 33 34 36 24 H41 V100 H36 C33 90 26 84 16 84 Z" className="fill-white" />
      <path d="M16 54 C28 52 34 42 38 26 M16 70 C28 72 34 82 38 98 M19 47 C28 46 33 40 36.5 30 M19 77 C28 78 33 84 36.5 94" className="stroke-cast" strokeWidth={FINE} />
      {/* Back plate, centre housing with oil feed and drain, heat shield. */}
      <rect x={41} y={18} width={6} height={88} rx={1.5} className="fill-panel" />
      <rect x={56} y={30} width={11} height={9} rx={1} className="fill-panel" />
      <rect x={54} y={85} width={15} height={9} rx={1} className="fill-panel" />
      <rect x={47} y={38} width={29} height={48} rx={4} className="fill-panel" />
      <circle cx={69} cy={50} r={3.5} className="stroke-cast fill-white" strokeWidth={FINE} />
      <rect x={76} y={28} width={4} height={68} rx={1} className="fill-panel" />
      {/* Turbine wheel, narrowing to the exducer, and the shaft end. */}
      <path d="M80 32 H85 C93 32 99 40 102 48 V76 C99 84 93 92 85 92 H80 Z" className="fill-white" />
      <path d="M85 36 V88 M91 40 V84 M97 46 V78" className="stroke-cast" strokeWidth={FINE} />
      <rect x={102} y={57} width={6} height={10} rx={1} className="fill-white" />
      <CentreLine x1={3} x2={115} y={62} />
    </>
  );
}

// The compressor volute turns clockwise and leaves tangentially to the right along its top.
const CH = { cx: 53, cy: 66, r0: 30, r1: 43, a0: -62 };
const chStart = at(CH.cx, CH.cy, CH.r0, CH.a0);
const chVolute = `${spiral(CH.cx, CH.cy, CH.r0, CH.r1, CH.a0, 270 - CH.a0)} H108 V${chStart[1]} L${chStart[0]} ${chStart[1]} Z`;

function CompressorHousing() {
  return (
    <>
      <path d={chVolute} className="fill-white" />
      <path d={`M104 ${CH.cy - CH.r1 - 2} V${chStart[1] + 2}`} strokeWidth={FINE} />
      <circle cx={CH.cx} cy={CH.cy} r={25} className="stroke-cast" strokeWidth={FINE} />
      {/* The inlet, with the compressor wheel seen through it. */}
      <circle cx={CH.cx} cy={CH.cy} r={19} className="fill-white" />
      <circle cx={CH.cx} cy={CH.cy} r={14.5} className="fill-panel" strokeWidth={FINE} />
      <path d={blades(CH.cx, CH.cy, 4, 14, 7, 38)} className="stroke-cast" strokeWidth={FINE} />
      <circle cx={CH.cx} cy={CH.cy} r={4} className="fill-white" strokeWidth={FINE} />
    </>
  );
}

// The turbine volute turns anticlockwise and its inlet drops tangentially to a flange at the foot of the left side.
const TH = { cx: 66, cy: 52, r0: 28, r1: 41, a0: 150 };
const thStart = at(TH.cx, TH.cy, TH.r0, TH.a0);
const thVolute = `${spiral(TH.cx, TH.cy, TH.r0, TH.r1, TH.a0, 180 - TH.a0 - 360)} V100 H${thStart[0]} L${thStart[0]} ${thStart[1]} Z`;

function TurbineHousing() {
  return (
    <>
      <path d={thVolute} className="fill-cast-line" />
      {/* Inlet flange, seen edge on, with its studs. */}
      <rect x={TH.cx - TH.r1 - 6} y={100} width={thStart[0] - (TH.cx - TH.r1) + 12} height={8} rx={1} className="fill-cast-line" />
      <path d={`M${TH.cx - TH.r1 - 2} 108 V114 M${thStart[0] + 2} 108 V114`} strokeWidth={FINE} />
      {/* Exhaust outlet with its V-band lip, and the turbine wheel inside. */}
      <circle cx={TH.cx} cy={TH.cy} r={22} className="fill-cast-line" />
      <circle cx={TH.cx} cy={TH.cy} r={17} className="fill-white" strokeWidth={FINE} />
      <path d={blades(TH.cx, TH.cy, 4.5, 16, 9, -8)} className="stroke-cast" strokeWidth={FINE} />
      <circle cx={TH.cx} cy={TH.cy} r={4.5} className="fill-panel" strokeWidth={FINE} />
    </>
  );
}

function FlangeGasket() {
  return (
    <>
      <path d="M30 22 H90 A10 10 0 0 1 100 32 V88 A10 10 0 0 1 90 98 H30 A10 10 0 0 1 20 88 V32 A10 10 0 0 1 30 22 Z" className="fill-white" />
      <rect x={40} y={40} width={40} height={40} rx={9} className="fill-paper" />
      {/* The embossed sealing bead around the port. */}
      <rect x={34} y={34} width={52} height={52} rx={13} className="stroke-cast" strokeWidth={FINE} />
      {[
        [31, 33],
        [89, 33],
        [31, 87],
        [89, 87],
      ].map(([x, y]) => (
        <circle key={`${x}-${y}`} cx={x} cy={y} r={4.5} className="fill-paper" />
      ))}
    </>
  );
}

const HOSE = 'M26 88 C62 88 58 32 94 32';

function HoseLine() {
  return (
    <>
      {/* A braided line: the outline drawn as a wide ink stroke under a narrower light one, ribs dashed across it. */}
      <path d={HOSE} strokeWidth={14} strokeLinecap="butt" />
      <path d={HOSE} className="stroke-white" strokeWidth={9} strokeLinecap="butt" />
      <path d={HOSE} className="stroke-cast-line" strokeWidth={9} strokeDasharray="1.5 3" strokeLinecap="butt" />
      {/* Hose ends and swivel nuts. */}
      <rect x={17} y={80} width={11} height={16} rx={1.5} className="fill-white" />
      <HexSide x={6} y={78} w={11} h={20} />
      <rect x={92} y={24} width={11} height={16} rx={1.5} className="fill-white" />
      <HexSide x={103} y={22} w={11} h={20} />
    </>
  );
}

function SiliconeCoupler() {
  return (
    <>
      <path d="M26 38 H94 A8 22 0 0 1 94 82 H26" className="fill-temper-tint" />
      <ellipse cx={26} cy={60} rx={8} ry={22} className="fill-temper-tint" />
      <ellipse cx={26} cy={60} rx={4.5} ry={15} className="fill-white" strokeWidth={FINE} />
      {/* Plies of the wall, and a T-bolt clamp near each end. */}
      <path d="M34 60 H86" className="stroke-cast" strokeWidth={FINE} strokeDasharray="4 4" />
      {[38, 76].map((x) => (
        <g key={x}>
          <rect x={x} y={35} width={8} height={50} rx={1.5} className="fill-white" />
          <rect x={x - 1.5} y={25} width={11} height={10} rx={1.5} className="fill-white" />
          <circle cx={x + 4} cy={30} r={2} className="fill-panel" strokeWidth={FINE} />
        </g>
      ))}
    </>
  );
}

// The clamp band runs round all but the top, where the bolt pulls its two ends together.
const VB = { cx: 60, cy: 64, outer: 42, inner: 31, gap: 24 };
const vbBand = (() => {
  const from = 270 + VB.gap;
  const to = 270 - VB.gap + 360;
  const [ox0, oy0] = at(VB.cx, VB.cy, VB.outer, from);
  const [ox1, oy1] = at(VB.cx, VB.cy, VB.outer, to);
  const [ix1, iy1] = at(VB.cx, VB.cy, VB.inner, to);
  const [ix0, iy0] = at(VB.cx, VB.cy, VB.inner, from);
  return `M${ox0} ${oy0} A${VB.outer} ${VB.outer} 0 1 1 ${ox1} ${oy1} L${ix1} ${iy1} A${VB.inner} ${VB.inner} 0 1 0 ${ix0} ${iy0} Z`;
})();
const vbGroove = (() => {
  const r = (VB.outer + VB.inner) / 2;
  const [x0, y0] = at(VB.cx, VB.cy, r, 270 + VB.gap + 4);
  const [x1, y1] = at(VB.cx, VB.cy, r, 270 - VB.gap - 4 + 360);
  return `M${x0} ${y0} A${r} ${r} 0 1 1 ${x1} ${y1}`;
})();

function VBandClamp() {
  const [lx] = at(VB.cx, VB.cy, VB.outer, 270 - VB.gap);
  const [rx] = at(VB.cx, VB.cy, VB.outer, 270 + VB.gap);
  return (
    <>
      <path d={vbBand} className="fill-white" />
      <path d={vbGroove} className="stroke-cast" strokeWidth={FINE} />
      {/* Trunnions on the band ends, the T-bolt through them and its nut. */}
      <rect x={lx - 6} y={14} width={9} height={18} rx={2} className="fill-panel" />
      <rect x={rx - 3} y={14} width={9} height={18} rx={2} className="fill-panel" />
      <rect x={lx - 12} y={20} width={rx - lx + 32} height={6} rx={1} className="fill-white" />
      <HexSide x={rx + 8} y={15} w={9} h={16} />
    </>
  );
}

function SmallFitting() {
  return (
    <>
      <Thread x={16} y={49} w={30} h={22} />
      <path d="M16 49 L13 52 V68 L16 71" className="fill-white" />
      <HexSide x={46} y={40} w={26} h={40} />
      {/* Nipple with a flare seat, and the bore shown hidden. */}
      <rect x={72} y={51} width={14} height={18} className="fill-white" />
      <path d="M86 51 L102 55 V65 L86 69 Z" className="fill-white" />
      <path d="M14 56 H100 M14 64 H100" className="stroke-cast" strokeWidth={1} strokeDasharray="3 2.5" />
      <CentreLine x1={6} x2={112} y={60} />
    </>
  );
}

const GAUGE = { cx: 60, cy: 60 };
const gaugeTicks = (() => {
  const paths: string[] = [];
  for (let i = 0; i <= 20; i++) {
    const a = 135 + (270 / 20) * i;
    const [x0, y0] = at(GAUGE.cx, GAUGE.cy, i % 4 === 0 ? 30 : 34, a);
    const [x1, y1] = at(GAUGE.cx, GAUGE.cy, 38, a);
    paths.push(`M${x0} ${y0} L${x1} ${y1}`);
  }
  return paths.join(' ');
})();
const gaugeNeedle = (() => {
  const [x, y] = at(GAUGE.cx, GAUGE.cy, 32, 250);
  const [bx, by] = at(GAUGE.cx, GAUGE.cy, 8, 70);
  return `M${bx} ${by} L${x} ${y}`;
})();

function DashGauge() {
  return (
    <>
      <circle cx={GAUGE.cx} cy={GAUGE.cy} r={50} className="fill-panel" />
      <circle cx={GAUGE.cx} cy={GAUGE.cy} r={43} className="fill-white" strokeWidth={FINE} />
      <path d={gaugeTicks} strokeWidth={FINE} />
      <rect x={49} y={78} width={22} height={9} rx={1.5} className="fill-paper stroke-cast" strokeWidth={FINE} />
      <path d={gaugeNeedle} className="stroke-temper" strokeWidth={3} />
      <circle cx={GAUGE.cx} cy={GAUGE.cy} r={5} className="fill-ink" />
    </>
  );
}

function SensorProbe() {
  return (
    <>
      {/* Lead, connector body, hex, thread and the probe tip. */}
      <path d="M4 86 C14 86 12 60 22 60" strokeWidth={4} />
      <rect x={22} y={48} width={24} height={24} rx={5} className="fill-panel" />
      <path d="M28 48 V72 M34 48 V72" className="stroke-cast" strokeWidth={FINE} />
      <HexSide x={46} y={42} w={14} h={36} />
      <Thread x={60} y={51} w={18} h={18} />
      <path d="M78 56.5 H110 A3.5 3.5 0 0 1 110 63.5 H78 Z" className="fill-white" />
      <CentreLine x1={40} x2={118} y={60} />
    </>
  );
}

function PlugInLogger() {
  return (
    <>
      {/* USB plug on a short lead. */}
      <path d="M30 78 C38 78 40 66 50 66" strokeWidth={4} />
      <rect x={16} y={71} width={14} height={14} rx={2.5} className="fill-panel" />
      <rect x={4} y={73} width={12} height={10} rx={1} className="fill-white" />
      <path d="M7 76.5 H10 M7 79.5 H10" className="stroke-cast" strokeWidth={FINE} />
      {/* The logger: a small box with a display, a status light and a lead out to the sensor. */}
      <rect x={50} y={34} width={56} height={50} rx={7} className="fill-panel" />
      <rect x={57} y={42} width={30} height={18} rx={2} className="fill-white" strokeWidth={FINE} />
      <path d="M61 48 H81 M61 54 H74" className="stroke-cast" strokeWidth={FINE} />
      <circle cx={96} cy={47} r={3.5} className="fill-temper stroke-temper" strokeWidth={FINE} />
      <path d="M57 70 H75 M57 76 H70" className="stroke-cast" strokeWidth={FINE} />
      <path d="M94 84 C94 96 104 96 108 106" strokeWidth={4} />
      <rect x={104} y={104} width={10} height={12} rx={2} className="fill-white" />
    </>
  );
}

const DRAWINGS: Record<IllustrationKind, () => ReactNode> = {
  turbocharger: Turbocharger,
  cartridge: Cartridge,
  'compressor-housing': CompressorHousing,
  'turbine-housing': TurbineHousing,
  'flange-gasket': FlangeGasket,
  'hose-line': HoseLine,
  'silicone-coupler': SiliconeCoupler,
  'v-band-clamp': VBandClamp,
  'small-fitting': SmallFitting,
  'dash-gauge': DashGauge,
  'sensor-probe': SensorProbe,
  'plug-in-logger': PlugInLogger,
};

/** A decorative line drawing of a kind of part; the text beside it says what the part is. */
export function PartDrawing({ kind, className }: { kind: IllustrationKind; className?: string }) {
  const Drawing = DRAWINGS[kind];
  return (
    <svg
      viewBox="0 0 120 120"
      aria-hidden="true"
      focusable="false"
      data-drawing={kind}
      className={`block stroke-ink ${className ?? ''}`}
      fill="none"
      strokeWidth={2.5}
      strokeLinecap="round"
      strokeLinejoin="round"
    >
      <Drawing />
    </svg>
  );
}
