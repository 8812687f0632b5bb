import { Gauge } from 'lucide-react';
import { lazy, Suspense } from 'react';
import { Link, useParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Caution } from '../../components/ui/caution';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useFrame } from '../../features/catalog/api/get-frame';
import { FrameFacts, FramePartsByKind } from '../../features/catalog/components/frame-facts';

// The drawing is its own chunk: it loads after the frame's data, never with the first page.
const ExplodedView = lazy(() => import('../../components/illustrations/exploded-view'));

export function FrameRoute() {
  const { code = '' } = useParams();
  const frame = useFrame(code.toUpperCase());

  if (frame.isPending) return <LoadingState label={`Loading frame ${code}…`} />;
  if (frame.isError) {
    return frame.error instanceof ApiError && frame.error.isNotFound ? (
      <div className="py-8">
        <h1 className="text-2xl font-bold">No frame {code}</h1>
        <p className="mt-2 text-cast">Frames have three-letter codes, such as CHS or GIM.</p>
        <Link to="/catalogue" className="mt-3 inline-block font-semibold text-temper underline">
          Browse the catalogue by frame
        </Link>
      </div>
    ) : (
      <ErrorState title="This frame did not load" message={frame.error.message} onRetry={() => frame.refetch()} />
    );
  }
  const f = frame.data;
  return (
    <article className="grid gap-8">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/catalogue" className="hover:underline">
          Catalogue
        </Link>{' '}
        / Frame {f.code}
      </nav>
      <header className="grid gap-4 md:grid-cols-[3fr_2fr]">
        <div>
          <p className="part-no text-lg text-cast">Frame {f.code}</p>
          <h1 className="text-3xl font-bold leading-tight">{f.name}</h1>
          <p className="mt-2 text-lg">
            For about {f.powerBandHp[0]}–{f.powerBandHp[1]} hp. {f.parts.length} parts on sale for this frame.
          </p>
        </div>
        <div className="grid content-start gap-3">
          <Link to={`/fitment?frame=${f.code}`} className={buttonClass('secondary')}>
            <Gauge aria-hidden className="size-4" />
            Check fitment for frame {f.code}
          </Link>
        </div>
      </header>
      <Suspense fallback={<LoadingState label="Loading the drawing…" />}>
        <ExplodedView frame={f} parts={f.parts} />
      </Suspense>
      <section aria-labelledby="frame-data-heading" className="grid gap-6 md:grid-cols-2">
        <div>
          <h2 id="frame-data-heading" className="text-xl font-bold">
            Frame data
          </h2>
          <FrameFacts frame={f} />
        </div>
        <Caution title="Before you fit or re-clock a unit">
          Turbochargers run hot and spin past 100,000 rpm: work on a cold unit, keep the oil inlet on top and the drain pointing down, and prime the oil supply before the
          first start. Have the work checked by a licensed mechanic and follow local rules.
        </Caution>
      </section>
      <section aria-labelledby="frame-parts-heading" className="grid gap-3">
        <h2 id="frame-parts-heading" className="text-xl font-bold">
          Parts of frame {f.code}
        </h2>
        <FramePartsByKind frame={f} />
      </section>
    </article>
  );
}
