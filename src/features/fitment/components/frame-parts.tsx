import { Ban, CircleCheck, Clock, ShoppingCart, TriangleAlert } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import type { PartSummary } from '../../../../shared/schemas/parts';
import { Button } from '../../../components/ui/button';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useAddToCart } from '../api/add-to-cart';
import { useFrameParts } from '../api/get-frame-parts';

const LINKED_CATEGORIES = [
  { slug: 'turbochargers', label: 'Complete turbochargers' },
  { slug: 'cartridges', label: 'Cartridges' },
  { slug: 'compressor-housings', label: 'Compressor housings' },
  { slug: 'turbine-housings', label: 'Turbine housings' },
] as const;

function StockWord({ stock }: { stock: PartSummary['stock'] }) {
  const { state, available } = stock;
  if (state === 'in-stock')
    return (
      <span className="inline-flex items-center gap-1 text-machined">
        <CircleCheck aria-hidden className="size-4" />
        In stock ({available})
      </span>
    );
  if (state === 'low')
    return (
      <span className="inline-flex items-center gap-1 text-amber">
        <TriangleAlert aria-hidden className="size-4" />
        Low stock ({available})
      </span>
    );
  if (state === 'out-of-stock')
    return (
      <span className="inline-flex items-center gap-1 text-cast">
        <Clock aria-hidden className="size-4" />
        Awaiting stock
      </span>
    );
  return (
    <span className="inline-flex items-center gap-1 text-cast">
      <Ban aria-hidden className="size-4" />
      Discontinued
    </span>
  );
}

/** The chosen frame's complete units and cartridges to buy, and links to everything built on it. */
export function FrameParts({ frameCode, fitment, onAddedToCart }: {
  frameCode: string;
  /** The saved check to attach to cart lines, once the buyer has saved it. */
  fitment: { id: number; name: string } | null;
  onAddedToCart?: () => unknown;
}) {
  const parts = useFrameParts(frameCode);
  const add = useAddToCart(onAddedToCart);
  const [added, setAdded] = useState<{ partNumber: string; withCheck: string | null } | null>(null);

  const counts = new Map(parts.data?.facets.category.map((f) => [f.value, f.count]) ?? []);
  const buyable = (category: string, n: number) =>
    (parts.data?.items ?? []).filter((p) => p.category === category && p.status === 'active' && p.stock.state !== 'out-of-stock').slice(0, n);
  const shortlist = [...buyable('turbochargers', 3), ...buyable('cartridges', 2)];

  return (
    <section aria-labelledby="frame-parts-heading" className="grid gap-3">
      <h3 id="frame-parts-heading" className="text-lg font-bold">
        Parts on frame <span className="part-no">{frameCode}</span>
      </h3>
      <ul className="flex flex-wrap gap-2">
        {LINKED_CATEGORIES.map((c) => (
          <li key={c.slug}>
            <Link
              to={`/catalogue?frame=${encodeURIComponent(frameCode)}&category=${c.slug}`}
              className="inline-flex min-h-10 items-center rounded-md bg-white px-3 font-semibold text-temper ring-1 ring-cast-line hover:ring-temper"
            >
              {c.label}
              {counts.has(c.slug) && <span className="tabular ml-1 font-normal text-cast">({counts.get(c.slug)})</span>}
            </Link>
          </li>
        ))}
      </ul>
      {parts.isPending ? (
        <LoadingState label={`Loading parts for ${frameCode}…`} />
      ) : parts.isError ? (
        <ErrorState title="The parts for this frame did not load" message={parts.error.message} onRetry={() => parts.refetch()} />
      ) : shortlist.length === 0 ? (
        <p className="text-cast">Nothing on this frame is in stock just now. The links above list every part, with back-order dates.</p>
      ) : (
        <ul className="divide-y divide-cast-line rounded-lg bg-white ring-1 ring-cast-line">
          {shortlist.map((p) => (
            <li key={p.partNumber} className="flex flex-wrap items-center gap-x-4 gap-y-2 p-3">
              <div className="min-w-0 flex-1 basis-64">
                <Link to={`/parts/${encodeURIComponent(p.partNumber)}`} className="part-no text-temper underline-offset-2 hover:underline">
                  {p.partNumber}
                </Link>
                <p className="text-sm">{p.title}</p>
                <p className="text-sm">
                  <StockWord stock={p.stock} />
                </p>
              </div>
              <p className="tabular font-bold">{formatPrice(p.priceCents)}</p>
              <Button
                variant="secondary"
                disabled={add.isPending}
                onClick={() =>
                  add.mutate(
                    { partNumber: p.partNumber, quantity: 1, ...(fitment ? { fitmentId: fitment.id } : {}) },
                    { onSuccess: () => setAdded({ partNumber: p.partNumber, withCheck: fitment?.name ?? null }) },
                  )
                }
              >
                <ShoppingCart aria-hidden className="size-4" />
                Add to cart<span className="sr-only"> {p.partNumber}</span>
              </Button>
            </li>
          ))}
        </ul>
      )}
      <div aria-live="polite">
        {added && (
          <p role="status" className="flex items-center gap-2 rounded-md bg-machined-tint p-3 text-ink">
            <CircleCheck aria-hidden className="size-5 text-machined" />
            <span>
              <span className="part-no">{added.partNumber}</span> is in your cart
              {added.withCheck ? <>, with the check “{added.withCheck}” attached</> : null}.{' '}
              <Link to="/cart" className="font-semibold text-temper underline underline-offset-2">
                Go to the cart
              </Link>
            </span>
          </p>
        )}
        {add.isError && (
          <p role="alert" className="rounded-md bg-oxide-tint p-3 font-semibold text-oxide">
            {add.error.message}
          </p>
        )}
      </div>
      {!fitment && <p className="text-sm text-cast">Save the check first to attach it to the cart line, so the order shows what the part was chosen for.</p>}
    </section>
  );
}
