import { useId, useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useAuditLog, type AuditFilters } from '../../features/office/api/get-audit-log';
import { AuditLogTable } from '../../features/office/components/audit-log-table';
import { OfficeGate, OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { Pager } from '../../features/office/components/pager';
import { officeAccess } from '../../features/office/lib/office-access';

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const FIELDS = ['part', 'user', 'from', 'to'] as const;
type Field = (typeof FIELDS)[number];

/** The filters live in the address, so a reload or a shared link shows the same entries. */
function readFilters(params: URLSearchParams): AuditFilters {
  const text = (k: string) => params.get(k)?.trim() || undefined;
  const day = (k: string) => (DAY.test(params.get(k) ?? '') ? params.get(k)! : undefined);
  const imp = Number(params.get('import'));
  return {
    part: text('part'),
    user: text('user'),
    from: day('from'),
    to: day('to'),
    ...(Number.isInteger(imp) && imp > 0 ? { import: imp } : {}),
    page: Math.max(1, Number(params.get('page')) || 1),
  };
}

const toParams = (f: AuditFilters) =>
  Object.fromEntries(Object.entries({ ...f, page: f.page > 1 ? f.page : undefined }).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]));

function AuditFiltersForm({ filters, onApply }: { filters: AuditFilters; onApply: (f: AuditFilters) => void }) {
  const id = useId();
  const [values, setValues] = useState<Record<Field, string>>({ part: filters.part ?? '', user: filters.user ?? '', from: filters.from ?? '', to: filters.to ?? '' });
  const [problem, setProblem] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (values.from && values.to && values.from > values.to) return setProblem('The “from” date is after the “to” date.');
    setProblem(null);
    onApply({ part: values.part.trim() || undefined, user: values.user.trim() || undefined, from: values.from || undefined, to: values.to || undefined, page: 1 });
  };
  const field = (k: Field, labelText: string, props: React.InputHTMLAttributes<HTMLInputElement>) => (
    <div className="grid content-start gap-1">
      <label htmlFor={`${id}-${k}`} className="font-semibold">
        {labelText}
      </label>
      <input
        id={`${id}-${k}`}
        value={values[k]}
        onChange={(e) => setValues({ ...values, [k]: e.target.value })}
        className="min-h-11 w-full rounded-md border border-cast-line bg-white px-3 focus:border-temper"
        {...props}
      />
    </div>
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Filter the audit log" className="grid gap-3 rounded-lg bg-white p-4 ring-1 ring-cast-line">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {field('part', 'Part number', { placeholder: 'e.g. FLG-50-0201', autoComplete: 'off', spellCheck: false })}
        {field('user', 'Who (name or e-mail)', { autoComplete: 'off' })}
        {field('from', 'From', { type: 'date' })}
        {field('to', 'To', { type: 'date' })}
      </div>
      {problem && (
        <p role="alert" className="font-semibold text-oxide">
          ✕ {problem}
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit">Show entries</Button>
        <Button
          variant="secondary"
          onClick={() => {
            setValues({ part: '', user: '', from: '', to: '' });
            onApply({ page: 1 });
          }}
        >
          Clear filters
        </Button>
      </div>
    </form>
  );
}

function AuditLog() {
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const log = useAuditLog(filters);
  const go = (f: AuditFilters) => setParams(toParams(f));
  return (
    <div className="grid gap-4">
      <AuditFiltersForm key={FIELDS.map((k) => filters[k] ?? '').join('|')} filters={filters} onApply={go} />
      {filters.import !== undefined && (
        <p>
          Showing the parts changed by one price import.{' '}
          <Link to={`/office/price-imports?import=${filters.import}`} className="font-semibold text-temper underline underline-offset-2">
            Open that import
          </Link>{' '}
          ·{' '}
          <button type="button" className="font-semibold text-temper underline underline-offset-2" onClick={() => go({ ...filters, import: undefined, page: 1 })}>
            Show every entry
          </button>
        </p>
      )}
      {log.isPending ? (
        <LoadingState label="Loading the audit log…" />
      ) : log.isError ? (
        <ErrorState title="The audit log did not load" message={log.error.message} onRetry={() => log.refetch()} />
      ) : log.data.total === 0 ? (
        <EmptyState title="No entries match">
          <p>Every change to a part — by hand or by a price list — is written here. Widen the dates or clear a filter.</p>
        </EmptyState>
      ) : (
        <>
          <Pager place="above" page={log.data.page} pageSize={log.data.pageSize} total={log.data.total} noun={['entry', 'entries']} onPage={(page) => go({ ...filters, page })} />
          <AuditLogTable items={log.data.items} />
          {log.data.total > log.data.pageSize && (
            <Pager place="below" page={log.data.page} pageSize={log.data.pageSize} total={log.data.total} noun={['entry', 'entries']} onPage={(page) => go({ ...filters, page })} />
          )}
        </>
      )}
    </div>
  );
}

export function OfficeAuditRoute() {
  const me = useMe();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid gap-5">
        <OfficeNav />
        <OfficePageHeader title="Audit log">Who changed what in the catalogue, and when: edits by hand and every part a price list changed. Dates are UTC days.</OfficePageHeader>
        <AuditLog />
      </div>
    </OfficeGate>
  );
}
