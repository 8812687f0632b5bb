import { ArrowRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatMoney, formatDateTime } from '../../../../shared/format';
import type { AuditAction } from '../../../../shared/allowed-values';
import type { AuditEntry } from '../../../../shared/schemas/admin-catalog';
import { Td, TableFrame, Th } from '../../../components/ui/table';

export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'part-created': 'Part added',
  'part-edited': 'Part edited',
  'part-superseded': 'Superseded',
  'part-links-set': 'Goes-with parts set',
  'part-photos-added': 'Photos added',
  'price-imported': 'Price list',
  'part-imported': 'Added by price list',
};

const FIELD_LABELS: Record<string, string> = {
  priceCents: 'Price',
  coreDepositCents: 'Core deposit',
  weightGrams: 'Weight',
  minStock: 'Minimum stock',
  frameCode: 'Frame',
  supersededBy: 'Superseded by',
  goesWith: 'Goes with',
  images: 'Photos',
  partNumber: 'Part number',
};
const label = (field: string) => FIELD_LABELS[field] ?? field.replace(/^specs\./, '').replace(/([A-Z])/g, ' $1').replace(/^./, (c) => c.toUpperCase());

/** A value as staff read it: money with separators, weight in kilograms, lists counted, nothing as a dash. */
function show(field: string, value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number' && field.endsWith('Cents')) return formatMoney(value);
  if (typeof value === 'number' && field === 'weightGrams') return `${(value / 1000).toLocaleString('en-US', { maximumFractionDigits: 3 })} kg`;
  if (Array.isArray(value)) return field === 'images' ? `${value.length} ${value.length === 1 ? 'photo' : 'photos'}` : value.join(', ') || '—';
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return text.length > 80 ? `${text.slice(0, 77)}…` : text;
}

function Changes({ entry }: { entry: AuditEntry }) {
  const fields = Object.entries(entry.changes);
  if (fields.length === 0) return <span className="text-cast">—</span>;
  return (
    <ul className="grid gap-0.5 text-sm">
      {fields.slice(0, 8).map(([field, { from, to }]) => (
        <li key={field} className="flex flex-wrap items-center gap-x-1">
          <span className="font-semibold">{label(field)}:</span>
          {entry.action !== 'part-created' && entry.action !== 'part-imported' && (
            <>
              <span className="tabular text-cast">{show(field, from)}</span>
              <ArrowRight aria-label="to" className="size-3.5" />
            </>
          )}
          <span className="tabular">{show(field, to)}</span>
        </li>
      ))}
      {fields.length > 8 && <li className="text-cast">and {fields.length - 8} more fields</li>}
    </ul>
  );
}

export function AuditLogTable({ items }: { items: AuditEntry[] }) {
  return (
    <TableFrame maxHeight="max-h-[75vh]">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Catalogue changes, newest first</caption>
        <thead className="sticky top-0 z-10 bg-panel">
          <tr>
            <Th>When</Th>
            <Th>Who</Th>
            <Th>What</Th>
            <Th>Part</Th>
            <Th>Changes</Th>
          </tr>
        </thead>
        <tbody>
          {items.map((e) => (
            <tr key={e.id} className="border-b border-cast-line align-top">
              <Td className="whitespace-nowrap tabular">{formatDateTime(e.createdAt)}</Td>
              <Td>
                {e.user}
                {e.userEmail && <span className="block text-sm text-cast">{e.userEmail}</span>}
              </Td>
              <Td>
                {AUDIT_ACTION_LABELS[e.action]}
                {e.priceImportId !== null && (
                  <Link to={`/office/price-imports?import=${e.priceImportId}`} className="block text-sm font-semibold text-temper underline underline-offset-2">
                    {e.priceImportFile ?? `import ${e.priceImportId}`}
                  </Link>
                )}
              </Td>
              <Td>
                {e.partNumber ? (
                  <Link to={`/office/parts/${encodeURIComponent(e.partNumber)}`} className="part-no whitespace-nowrap text-temper underline underline-offset-2">
                    {e.partNumber}
                  </Link>
                ) : (
                  '—'
                )}
              </Td>
              <Td>
                <Changes entry={e} />
              </Td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}
