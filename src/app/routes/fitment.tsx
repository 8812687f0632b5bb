import { useQueryClient } from '@tanstack/react-query';
import { Gauge } from 'lucide-react';
import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FITMENT_CAUTIONS } from '../../../shared/fitment/check';
import type { FitmentRequest } from '../../../shared/schemas/fitment';
import type { SavedFitment } from '../../../shared/schemas/saved-fitments';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { useFrameMaps } from '../../features/fitment/api/get-frame-maps';
import { useSavedFitment } from '../../features/fitment/api/get-saved-fitment';
import { useRunFitmentCheck } from '../../features/fitment/api/run-fitment-check';
import { formValuesFor } from '../../features/fitment/lib/form-values';
import { FitmentCautions } from '../../features/fitment/components/fitment-cautions';
import { FitmentFormSlot } from '../../features/fitment/components/fitment-form-slot';
import { useUnitSystem } from '../../features/fitment/lib/use-unit-system';
import { FRAME_CODE_PATTERN } from '../../../shared/part-number';

// The answer's views (build sheet, compressor map, candidates) load when a check is run, beside its request, or when
// the form is first touched: a first visit to the form does not wait for them.
const loadResults = () => import('../../features/fitment/components/fitment-results');
const FitmentResults = lazy(() => loadResults().then((m) => ({ default: m.FitmentResults })));
const preloadResults = () => void loadResults().catch(() => undefined);

export function FitmentRoute() {
  const [params] = useSearchParams();
  const frameParam = params.get('frame')?.toUpperCase() ?? null;
  const cameFrom = frameParam && FRAME_CODE_PATTERN.test(frameParam) ? frameParam : null;
  const savedParam = params.get('saved');
  const savedId = savedParam && /^\d{1,12}$/.test(savedParam) ? Number(savedParam) : null;

  const me = useMe();
  const signedIn = Boolean(me.data?.user);
  const dealer = me.data?.user?.dealer;
  const canBackorder = me.data?.user?.role === 'dealer' && dealer?.status === 'approved' && Boolean(dealer.tier);
  const queryClient = useQueryClient();
  const maps = useFrameMaps();
  const check = useRunFitmentCheck();
  const [system, setSystem] = useUnitSystem();
  const [request, setRequest] = useState<FitmentRequest | null>(null);
  // Each run gets a fresh results view, so its choices (build, bearing, map) start from the new answer.
  const [runId, setRunId] = useState(0);
  const [refusedHere, setRefusedHere] = useState(false);
  const [saved, setSaved] = useState<Pick<SavedFitment, 'id' | 'name'> | null>(null);
  const [form, setForm] = useState(() => ({ key: 0, values: formValuesFor(null, system) }));
  const savedCheck = useSavedFitment(savedId !== null && signedIn ? savedId : null);
  const loadedSaved = useRef<number | null>(null);

  const run = (next: FitmentRequest, keep: Pick<SavedFitment, 'id' | 'name'> | null = null) => {
    preloadResults();
    setRequest(next);
    setSaved(keep);
    setRefusedHere(false);
    check.mutate(next, { onSuccess: () => setRunId((n) => n + 1) });
  };

  // Opening a saved check loads it into the form and runs it again, with today's frames.
  useEffect(() => {
    const item = savedCheck.data;
    if (!item || loadedSaved.current === item.id) return;
    loadedSaved.current = item.id;
    setForm((f) => ({ key: f.key + 1, values: formValuesFor(item.input, system) }));
    run(item.input, { id: item.id, name: item.name });
    // eslint-disable-next-line react-hooks/exhaustive-deps -- runs once per saved check opened
  }, [savedCheck.data]);

  const cameFromFrame = cameFrom ? maps.data?.items.find((f) => f.code === cameFrom) : undefined;
  const refusal = check.error instanceof ApiError && check.error.isValidation ? check.error : undefined;
  const validation = refusal?.fieldErrors;

  return (
    <div className="grid gap-6">
      <header className="grid gap-2">
        <h1 className="text-3xl font-bold">Fitment check</h1>
        <p className="max-w-3xl text-lg">
          Tell us about the engine and what you want from it. We answer with a build to order: the frame, bearing and housings, with the parts
          that go together, checked on every Vanecraft frame’s compressor map from the first boost to peak power.
        </p>
        <p>
          {signedIn ? (
            <Link to="/fitment/saved" className="font-semibold text-temper underline underline-offset-2">
              Your saved checks
            </Link>
          ) : (
            <span className="text-cast">
              <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
                Sign in to save
              </Link>{' '}
              checks and attach them to orders.
            </span>
          )}
        </p>
      </header>

      {cameFrom && (
        <div role="note" className="flex items-center gap-3 rounded-md border border-temper bg-temper-tint p-4">
          <Gauge aria-hidden className="size-5 shrink-0 text-temper" />
          <p>
            Checking frame <span className="part-no">{cameFrom}</span>
            {cameFromFrame ? ` ${cameFromFrame.name}` : ''}: fill in your engine and we show it on that frame’s map, ranked against the others.
          </p>
        </div>
      )}
      {savedId !== null && !signedIn && !me.isPending && (
        <ErrorState title="Sign in to open a saved check" message="Saved checks belong to the account that saved them." />
      )}
      {savedCheck.isError && (
        <ErrorState
          title="That saved check did not open"
          message={savedCheck.error instanceof ApiError && savedCheck.error.isNotFound ? 'We have no saved check with that number on your account.' : savedCheck.error.message}
        />
      )}

      <div className="grid items-start gap-8 lg:grid-cols-[26rem_minmax(0,1fr)]">
        <div className="rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line" onFocus={preloadResults} onPointerDown={preloadResults}>
          {/* A stand-in of the same fields until the visitor reaches for the form; then the form, with what was typed. */}
          <FitmentFormSlot
            key={form.key}
            initialValues={form.values}
            system={system}
            onSystemChange={setSystem}
            onSubmit={(next) => run(next)}
            pending={check.isPending}
            serverFieldErrors={validation}
            // A refused submit clears the last answer: no build is offered for values that are not on the form.
            onRefused={() => {
              check.reset();
              setRequest(null);
              setRefusedHere(true);
            }}
          />
        </div>
        <div className="min-w-0">
          {check.isPending || savedCheck.isFetching ? (
            <LoadingState label="Checking every frame…" />
          ) : refusal ? (
            <ErrorState
              title="The check was refused"
              message={`${refusal.message}${Object.keys(refusal.fieldErrors).length > 0 ? ': the values marked in the form need fixing.' : '.'}`}
            />
          ) : check.isError ? (
            <ErrorState title="The check did not run" message={check.error.message} onRetry={() => request && run(request, saved)} />
          ) : refusedHere ? (
            <EmptyState title="Nothing checked">
              Fix the values marked in the form, then press <span className="font-semibold text-ink">Check fitment</span> again.
            </EmptyState>
          ) : check.data && request ? (
            <Suspense fallback={<LoadingState label="Checking every frame…" />}>
              <FitmentResults
                key={runId}
                request={request}
                result={check.data}
                system={system}
                cameFrom={cameFrom}
                signedIn={signedIn}
                canBackorder={canBackorder}
                saved={saved}
                onSaved={(s) => setSaved({ id: s.id, name: s.name })}
                onAddedToCart={() => queryClient.invalidateQueries({ queryKey: cartKeys.all })}
              />
            </Suspense>
          ) : (
            <div className="grid gap-4">
              <EmptyState title="No check yet">
                Fill in the engine and press <span className="font-semibold text-ink">Check fitment</span>. The starting values are a 2.0 L petrol
                street engine; change them to yours. You get a build sheet: the frame, bearing and housings to order as one build, the spool it gives,
                the engine’s line on the compressor map, and the cautions its numbers raise.
              </EmptyState>
              <FitmentCautions cautions={FITMENT_CAUTIONS} />
            </div>
          )}
        </div>
      </div>
    </div>
  );
}
