import { Wrench } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/format';
import { APPLICATION_LABELS, type UnitSummary } from '../../../../shared/schemas/units';
import { buttonClass } from '../../../components/ui/button';
import { Pager, pageSpan } from '../../../components/ui/pager';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useMyUnits } from '../api/get-my-units';
import { ServiceDue } from './service-due';

const bearingWord = (b: UnitSummary['bearing']) => (b === 'ball' ? 'Ball bearing' : 'Journal bearing');

function UnitCard({ unit }: { unit: UnitSummary }) {
  return (
    <li className="grid gap-3 rounded-lg border border-cast-line bg-white p-4">
      <div className="grid gap-1">
        <Link to={`/units/${encodeURIComponent(unit.serial)}`} className="part-no w-fit text-lg text-temper underline underline-offset-2 hover:text-temper-deep">
          {unit.serial}
        </Link>
        <p>
          {unit.partNumber && <span className="part-no mr-2">{unit.partNumber}</span>}
          {unit.title ?? `${unit.frameCode ?? ''} unit`}
        </p>
      </div>
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm">
        <dt className="text-cast">Bearing</dt>
        <dd>{bearingWord(unit.bearing)}</dd>
        <dt className="text-cast">Use</dt>
        <dd>{APPLICATION_LABELS[unit.application]}</dd>
        <dt className="text-cast">Last service</dt>
        <dd>{unit.lastServiceAt ? formatDate(unit.lastServiceAt) : <span className="text-cast">None yet (sold {formatDate(unit.since)})</span>}</dd>
        <dt className="text-cast">Next service</dt>
        <dd>
          <ServiceDue dueOn={unit.nextServiceDue} />
          <span className="block text-cast">every {unit.intervalMonths} months</span>
        </dd>
      </dl>
      <Link to={`/service/new?serial=${encodeURIComponent(unit.serial)}`} className={`${buttonClass('secondary')} w-fit`}>
        <Wrench aria-hidden className="size-4" />
        Book a service<span className="sr-only"> for {unit.serial}</span>
      </Link>
    </li>
  );
}

/** "My units": the signed-in buyer's units and their trade account's, each with its service state. */
export function MyUnitsList({ page, onPage }: { page: number; onPage: (page: number) => void }) {
  const units = useMyUnits(page);
  if (units.isPending) return <LoadingState label="Loading your units…" />;
  if (units.isError) return <ErrorState title="Your units did not load" message={units.error.message} onRetry={() => void units.refetch()} />;
  const { items, total, pageSize } = units.data;
  if (total === 0) {
    return (
      <EmptyState title="No units yet">
        Complete turbochargers and cartridges you buy get a serial when they are packed, and show here with their service dates.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4">
      <p className="tabular text-cast">{pageSpan(page, pageSize, total)} units</p>
      <ul className="grid gap-4 md:grid-cols-2" aria-label="Your units">
        {items.map((u) => (
          <UnitCard key={u.serial} unit={u} />
        ))}
      </ul>
      <Pager page={page} pageSize={pageSize} total={total} onPage={onPage} label="Pages of units" />
    </div>
  );
}
