import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import { LoadingState } from '../../../components/ui/states';
import { useFrameDetail } from '../api/get-frame-detail';

const ExplodedView = lazy(() => import('../../../components/illustrations/exploded-view'));

/** The recommended frame taken apart, each piece opening the frame's parts for it. */
export function FrameExploded({ frameCode }: { frameCode: string }) {
  const frame = useFrameDetail(frameCode);
  if (frame.isError) return null;
  return (
    <div className="grid gap-2">
      {frame.data ? (
        <Suspense fallback={<LoadingState label="Loading the drawing…" />}>
          <ExplodedView frame={frame.data} parts={frame.data.parts} headingLevel={3} />
        </Suspense>
      ) : (
        <LoadingState label={`Loading frame ${frameCode}…`} />
      )}
      <Link to={`/frames/${encodeURIComponent(frameCode)}`} className="font-semibold text-temper underline">
        Everything about frame {frameCode}
      </Link>
    </div>
  );
}
