import { Link } from 'react-router-dom';
import { categoryLabel, formatPrice } from '../../../../shared/catalog';
import type { PartSummary } from '../../../../shared/schemas/parts';
import { dealerUnitPriceCents, type DealerTier } from '../../../../shared/pricing';
import { PartPicture } from '../../../components/illustrations/part-picture';
import { specSummary } from './spec-rows';
import { StockBadge } from './stock-badge';

/** A part in a list; with a trade tier, the dealer's price leads and the retail price is shown beside it. */
export function PartListItem({ part, tradeTier }: { part: PartSummary; tradeTier?: DealerTier | null }) {
  return (
    <li className="grid grid-cols-[3.5rem_minmax(0,1fr)] gap-x-3 gap-y-2 border-b border-cast-line py-4 sm:grid-cols-[4.5rem_minmax(0,1fr)_auto] sm:gap-x-5">
      <PartPicture part={part} photo={part.photo} className="size-14 sm:size-18" />
      <div className="min-w-0">
        <p className="flex flex-wrap items-baseline gap-x-3 text-sm text-cast">
          <span className="part-no text-ink">{part.partNumber}</span>
          <span>{categoryLabel(part.category)}</span>
          {part.frameCode && <span>Frame {part.frameCode}</span>}
          {part.condition === 'exchange' && <span className="rounded bg-temper-tint px-1.5 text-temper-deep">Exchange</span>}
          {part.status === 'superseded' && <span className="rounded bg-panel px-1.5">Superseded by {part.supersededBy}</span>}
        </p>
        <h3 className="mt-0.5 text-lg font-semibold">
          <Link to={`/parts/${encodeURIComponent(part.partNumber)}`} className="hover:text-temper hover:underline">
            {part.title}
          </Link>
        </h3>
        <p className="text-sm text-cast">{specSummary(part.specs)}</p>
        {part.matched && part.matched.length > 0 && (
          <p className="mt-1 text-sm text-temper-deep">
            <span className="sr-only">Why this matched: </span>
            {part.matched.map((m) => m.text).join(' · ')}
          </p>
        )}
      </div>
      <div className="col-start-2 flex flex-wrap items-baseline gap-x-4 gap-y-1 sm:col-start-3 sm:flex-col sm:flex-nowrap sm:items-end sm:gap-1">
        {tradeTier ? (
          <span className="text-right">
            <span className="tabular block text-xl font-bold">
              <span className="sr-only">Trade price </span>
              {formatPrice(dealerUnitPriceCents(part.priceCents, tradeTier))}
            </span>
            <span className="tabular text-sm text-cast">retail {formatPrice(part.priceCents)}</span>
          </span>
        ) : (
          <span className="tabular text-xl font-bold">{formatPrice(part.priceCents)}</span>
        )}
        {part.coreDepositCents > 0 && <span className="tabular text-sm text-cast">+ {formatPrice(part.coreDepositCents)} core deposit</span>}
        <StockBadge stock={part.stock} />
      </div>
    </li>
  );
}
