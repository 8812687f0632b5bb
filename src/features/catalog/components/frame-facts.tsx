import { Link } from 'react-router-dom';
import { CATEGORIES, formatPrice } from '../../../../shared/catalog';
import type { FrameDetail } from '../../../../shared/schemas/parts';
import { StockBadge } from './stock-badge';

const ar = (values: number[]) => (values.length ? values.map((v) => v.toFixed(2)).join(', ') : '—');

/** What a frame is: wheel sizes, trim, housings on sale, bearings, ratings. */
export function FrameFacts({ frame }: { frame: FrameDetail }) {
  const rows: Array<[string, string]> = [
    ['Power band', `about ${frame.powerBandHp[0]}–${frame.powerBandHp[1]} hp (petrol, rated flow)`],
    ['Compressor wheel', `${frame.inducerMm} mm inducer, ${frame.exducerMm} mm exducer (${frame.trimPct} trim)`],
    ['Turbine wheel', `${frame.turbineWheelMm} mm`],
    ['Compressor housing A/R', ar(frame.compressorArOptions)],
    ['Turbine housing A/R', ar(frame.turbineArOptions)],
    ['Turbine inlet flange', frame.flangePattern],
    ['Bearings', frame.bearingOptions.map((b) => (b === 'ball' ? 'ball bearing' : 'journal bearing')).join(' or ')],
    ['Maximum shaft speed', `${frame.maxShaftRpm.toLocaleString('en-US')} rpm`],
    ['Maximum pressure ratio', frame.maxPressureRatio.toFixed(1)],
    ['Rated air flow', `${frame.maxFlowLbMin} lb/min (corrected to ${frame.flowReference.temperatureK} K, ${frame.flowReference.pressureKpa} kPa)`],
    ['Complete unit weight', `${frame.weightKg} kg`],
  ];
  return (
    <table className="w-full border-collapse text-left">
      <tbody>
        {rows.map(([label, value]) => (
          <tr key={label} className="border-b border-cast-line">
            <th scope="row" className="py-2 pr-4 align-top font-semibold">
              {label}
            </th>
            <td className="tabular py-2">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The frame's parts on sale, one list per kind of part, in the catalogue's order. */
export function FramePartsByKind({ frame }: { frame: FrameDetail }) {
  const kinds = CATEGORIES.map((c) => ({ ...c, parts: frame.parts.filter((p) => p.category === c.slug) })).filter((k) => k.parts.length > 0);
  return (
    <div className="grid gap-6">
      {kinds.map((k) => (
        <section key={k.slug} aria-labelledby={`kind-${k.slug}`} className="grid gap-2">
          <h3 id={`kind-${k.slug}`} className="text-lg font-bold">
            {k.label} <span className="tabular font-normal text-cast">({k.parts.length})</span>
          </h3>
          <ul className="grid gap-1">
            {k.parts.map((p) => (
              <li key={p.partNumber} className="grid grid-cols-[minmax(0,1fr)_auto] items-baseline gap-x-3 border-b border-cast-line py-2 sm:grid-cols-[9.5rem_minmax(0,1fr)_auto_auto]">
                <Link to={`/parts/${encodeURIComponent(p.partNumber)}`} className="part-no text-temper underline">
                  {p.partNumber}
                </Link>
                <span className="col-span-2 row-start-2 text-sm sm:col-span-1 sm:row-start-1 sm:col-start-2">{p.title}</span>
                <span className="tabular text-right font-semibold sm:col-start-3">{formatPrice(p.priceCents)}</span>
                <span className="hidden sm:block">
                  <StockBadge stock={p.stock} />
                </span>
              </li>
            ))}
          </ul>
          <Link to={`/catalogue?frame=${encodeURIComponent(frame.code)}&category=${k.slug}`} className="text-sm font-semibold text-temper underline">
            {k.label} of {frame.code} in the catalogue
          </Link>
        </section>
      ))}
    </div>
  );
}
