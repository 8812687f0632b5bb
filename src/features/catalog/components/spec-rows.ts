import type { Specs } from '../../../../shared/schemas/parts';

const mm = (v: number) => `${v} mm`;
const ar = (v: number) => v.toFixed(2);

/** The specification rows worth showing for a part, in a fixed order, with units. */
export function specRows(specs: Specs): Array<{ label: string; value: string }> {
  const rows: Array<[string, string | null]> = [
    ['Bearing', specs.bearing ? (specs.bearing === 'ball' ? 'Ball bearing' : 'Journal bearing') : null],
    ['Compressor A/R', specs.compressorAr != null ? ar(specs.compressorAr) : null],
    ['Turbine A/R', specs.turbineAr != null ? ar(specs.turbineAr) : null],
    ['Trim', specs.trimPct != null ? String(specs.trimPct) : null],
    ['Inducer', specs.inducerMm != null ? mm(specs.inducerMm) : null],
    ['Exducer', specs.exducerMm != null ? mm(specs.exducerMm) : null],
    ['Flange pattern', specs.flangePattern],
    ['Inlet', specs.inletMm != null ? mm(specs.inletMm) : null],
    ['Outlet', specs.outletMm != null ? mm(specs.outletMm) : null],
    ['Material', specs.material],
    ['Wastegate', specs.wastegate],
    ['Cooling', specs.cooling],
    ['Gauge type', specs.gaugeType],
    ['Range', specs.rangeText],
    ['Mounting', specs.mounting],
    ['Connection', specs.connection],
  ];
  return rows.filter((r): r is [string, string] => r[1] !== null).map(([label, value]) => ({ label, value }));
}

/** A one-line summary for lists: the three most telling specs. */
export function specSummary(specs: Specs): string {
  return specRows(specs)
    .slice(0, 3)
    .map((r) => `${r.label} ${r.value}`)
    .join(' · ');
}
