import { ArrowRight, Gauge } from 'lucide-react';
import { lazy, Suspense, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { categoryLabel, formatPrice } from '../../../shared/catalog';
import { clockingOf, pieceForCategory, takesOrientation, type Orientation } from '../../../shared/exploded-view';
import { buttonClass } from '../../components/ui/button';
import { PartPicture, partPhotoUrl } from '../../components/illustrations/part-picture';
import { ApiError } from '../../lib/api-client';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { NearView } from '../../components/ui/near-view';
import { useMe } from '../../features/auth/api/get-me';
import { AddToCart } from '../../features/cart/components/add-to-cart';
import { usePart } from '../../features/catalog/api/get-part';
import { useFrame } from '../../features/catalog/api/get-frame';
import { PartCautions } from '../../features/catalog/components/part-cautions';
import { PartListItem } from '../../features/catalog/components/part-list-item';
import { specRows } from '../../features/catalog/components/spec-rows';
import { StockBadge } from '../../features/catalog/components/stock-badge';

// The drawing is its own chunk, loaded once the part's frame is known and its place comes near the screen.
const ExplodedView = lazy(() => import('../../components/illustrations/exploded-view'));
// Lists are for approved dealers only: the form (and its parts) loads for them, not with every visit to a part.
const AddToList = lazy(() => import('../../features/lists/components/add-to-list').then((m) => ({ default: m.AddToList })));

export function PartRoute() {
  const { partNumber = '' } = useParams();
  const part = usePart(partNumber);
  const me = useMe();
  const frame = useFrame(part.data?.frame?.code ?? null);
  // A complete unit's housing positions, chosen here; null keeps the frame's standard position.
  const [orientation, setOrientation] = useState<{ partNumber: string; value: Orientation } | null>(null);
  // A fitment screen links here with ?fitment=<saved check id> so the line remembers what it was chosen for.
  const fitmentParam = Number(useSearchParams()[0].get('fitment'));
  const dealer = me.data?.user?.role === 'dealer' && me.data.user.dealer?.status === 'approved' ? me.data.user.dealer : null;

  if (part.isPending) return <LoadingState label={`Loading ${partNumber}…`} />;
  if (part.isError) {
    return part.error instanceof ApiError && part.error.isNotFound ? (
      <div className="py-8">
        <h1 className="text-2xl font-bold">No part {partNumber}</h1>
        <p className="mt-2 text-cast">We have no part with that number. Search for it: the search forgives dashes, case and small typos.</p>
        <Link to={`/catalogue?q=${encodeURIComponent(partNumber)}`} className="mt-3 inline-block font-semibold text-temper underline">
          Search for “{partNumber}”
        </Link>
      </div>
    ) : (
      <ErrorState title="This part did not load" message={part.error.message} onRetry={() => part.refetch()} />
    );
  }
  const p = part.data;
  const rows = specRows(p.specs);
  const first = p.images[0];
  const pictureSize = 'size-28 sm:size-40 lg:size-48';
  const clocking = p.frame && takesOrientation(p.category) ? clockingOf(p.frame) : null;
  const chosen = clocking ? (orientation?.partNumber === p.partNumber ? orientation.value : clocking.standard) : null;

  return (
    <article className="grid gap-8">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/catalogue" className="hover:underline">
          Catalogue
        </Link>{' '}
        /{' '}
        <Link to={`/catalogue?category=${p.category}`} className="hover:underline">
          {categoryLabel(p.category)}
        </Link>
        {p.frameCode && (
          <>
            {' '}
            /{' '}
            <Link to={`/frames/${p.frameCode}`} className="hover:underline">
              Frame {p.frameCode}
            </Link>
          </>
        )}
      </nav>

      {p.replacement && (
        <div role="note" className="flex flex-wrap items-center gap-3 rounded-md border border-temper bg-temper-tint p-4">
          <p>
            <span className="part-no">{p.partNumber}</span> has been superseded. It is replaced by{' '}
            <span className="part-no">{p.replacement.partNumber}</span>.
          </p>
          <Link to={`/parts/${encodeURIComponent(p.replacement.partNumber)}`} className={buttonClass('primary')}>
            See {p.replacement.partNumber}
            <ArrowRight aria-hidden className="size-4" />
          </Link>
        </div>
      )}

      <header className="grid gap-6 md:grid-cols-[3fr_2fr]">
        <div className="grid content-start gap-4 sm:grid-cols-[auto_minmax(0,1fr)] sm:gap-6">
          {/* The first photo takes the drawing's place and opens full size; the others follow the description. */}
          {first ? (
            <a
              href={partPhotoUrl(first)}
              target="_blank"
              rel="noreferrer"
              className={`${pictureSize} block overflow-hidden rounded-md bg-white ring-1 ring-cast-line hover:ring-2 hover:ring-temper`}
            >
              <img src={partPhotoUrl(first)} alt={`${p.title}, photo 1 of ${p.images.length}`} className="size-full object-contain" />
            </a>
          ) : (
            <PartPicture part={p} photo={null} className={pictureSize} />
          )}
          <div className="min-w-0">
            <p className="part-no text-lg text-cast">{p.partNumber}</p>
            <h1 className="text-3xl font-bold leading-tight">{p.title}</h1>
            <p className="mt-3 text-lg">{p.description}</p>
            {p.images.length > 1 && (
              <ul aria-label="More photos" className="mt-4 flex flex-wrap gap-3">
                {p.images.slice(1).map((name, i) => (
                  <li key={name}>
                    <a href={partPhotoUrl(name)} target="_blank" rel="noreferrer" className="block rounded-md ring-1 ring-cast-line hover:ring-temper">
                      <img
                        src={partPhotoUrl(name)}
                        alt={`${p.title}, photo ${i + 2} of ${p.images.length}`}
                        loading="lazy"
                        className="size-36 rounded-md bg-white object-contain"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            )}
            {(p.crossReferences.length > 0 || p.earlierNumbers.length > 0) && (
              <dl className="mt-3 grid gap-1 text-sm">
                {p.earlierNumbers.length > 0 && (
                  <div className="flex gap-2">
                    <dt className="font-semibold">Earlier numbers:</dt>
                    <dd className="part-no">{p.earlierNumbers.join(', ')}</dd>
                  </div>
                )}
                {p.crossReferences.length > 0 && (
                  <div className="flex gap-2">
                    <dt className="font-semibold">Cross-references:</dt>
                    <dd>
                      {p.crossReferences.map((x) => (
                        <span key={x.number} className="part-no mr-2">
                          {x.number}
                        </span>
                      ))}
                    </dd>
                  </div>
                )}
              </dl>
            )}
            <figure className="mt-4 inline-grid justify-items-start gap-1">
              {/* Drawn by the server (bwip-js); the digits under the bars are part of the drawing. */}
              <img
                src={`/api/parts/${encodeURIComponent(p.partNumber)}/gtin.svg`}
                alt={`EAN-13 barcode of GTIN ${p.gtin}`}
                loading="lazy"
                width={114}
                height={56}
                className="h-14 w-auto bg-white"
              />
              <figcaption className="text-sm text-cast">
                GTIN <span className="tabular">{p.gtin}</span>
              </figcaption>
            </figure>
          </div>
        </div>
        <div className="grid content-start gap-3 rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line">
          <p className="tabular text-3xl font-bold">{formatPrice(p.priceCents)}</p>
          {p.coreDepositCents > 0 && (
            <p className="text-sm">
              Plus a refundable core deposit of <span className="tabular font-semibold">{formatPrice(p.coreDepositCents)}</span>, paid back when
              your old unit is returned in rebuildable condition.
            </p>
          )}
          <StockBadge stock={p.stock} />
          {me.data?.user?.role !== 'warehouse' && me.data?.user?.role !== 'workshop' && (
            <AddToCart
              partNumber={p.partNumber}
              retailCents={p.priceCents}
              available={p.stock.available}
              discontinued={p.status === 'discontinued'}
              tier={dealer?.tier ?? null}
              {...(Number.isInteger(fitmentParam) && fitmentParam > 0 && me.data?.user ? { fitmentId: fitmentParam } : {})}
              {...(clocking && chosen ? { orientation: { clocking, value: chosen, onChange: (value: Orientation) => setOrientation({ partNumber: p.partNumber, value }) } } : {})}
            />
          )}
          {dealer && (
            // The button's height meanwhile, so the lines below do not move when it comes.
            <Suspense fallback={<div className="min-h-11" aria-hidden />}>
              <AddToList source={{ kind: 'part', partNumber: p.partNumber }} />
            </Suspense>
          )}
          <p className="tabular text-sm text-cast">Shipping weight {(p.weightGrams / 1000).toFixed(p.weightGrams < 1000 ? 2 : 1)} kg</p>
          {p.frame && (
            <Link to={`/fitment?frame=${p.frame.code}`} className={buttonClass('secondary')}>
              <Gauge aria-hidden className="size-4" />
              Check fitment for frame {p.frame.code}
            </Link>
          )}
        </div>
      </header>

      <section aria-labelledby="spec-heading" className="grid gap-6 md:grid-cols-2">
        <div>
          <h2 id="spec-heading" className="text-xl font-bold">
            Specification
          </h2>
          <table className="mt-2 w-full border-collapse text-left">
            <tbody>
              {p.frame && (
                <tr className="border-b border-cast-line">
                  <th scope="row" className="py-2 pr-4 font-semibold">
                    Frame
                  </th>
                  <td className="tabular py-2">
                    <Link to={`/frames/${p.frame.code}`} className="text-temper underline">
                      {p.frame.code} {p.frame.name}
                    </Link>{' '}
                    · {p.frame.powerBandHp[0]}–{p.frame.powerBandHp[1]} hp · max {p.frame.maxShaftRpm.toLocaleString('en-US')} rpm
                  </td>
                </tr>
              )}
              {rows.map((r) => (
                <tr key={r.label} className="border-b border-cast-line">
                  <th scope="row" className="py-2 pr-4 font-semibold">
                    {r.label}
                  </th>
                  <td className="tabular py-2">{r.value}</td>
                </tr>
              ))}
              <tr className="border-b border-cast-line">
                <th scope="row" className="py-2 pr-4 font-semibold">
                  Condition
                </th>
                <td className="py-2">{p.condition === 'exchange' ? 'Remanufactured, on exchange' : 'New'}</td>
              </tr>
            </tbody>
          </table>
        </div>
        <PartCautions category={p.category} />
      </section>

      {p.frame && frame.data && (
        // Below the specification: its code loads as the visitor comes near it, not with the page.
        <NearView minHeight="24rem" label={`Drawing of frame ${frame.data.code}, taken apart`}>
          <Suspense fallback={<LoadingState label="Loading the drawing…" />}>
            <ExplodedView frame={frame.data} parts={frame.data.parts} highlight={pieceForCategory(p.category)} orientation={chosen} />
          </Suspense>
        </NearView>
      )}

      {p.goesWith.length > 0 && (
        <section aria-labelledby="goes-with-heading">
          <h2 id="goes-with-heading" className="text-xl font-bold">
            Goes with
          </h2>
          <ul>
            {p.goesWith.map((g) => (
              <PartListItem key={g.partNumber} part={g} />
            ))}
          </ul>
        </section>
      )}
    </article>
  );
}
