import { ShoppingCart, TriangleAlert } from 'lucide-react';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import type { FitmentAssumptions, FitmentCandidate, FitmentRequest } from '../../../../shared/schemas/fitment';
import type { FitmentFrameMap, SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useAddBuildToCart } from '../api/add-build-to-cart';
import { useBuildParts } from '../api/get-build-parts';
import { usePart } from '../api/get-part';
import { fittingLines, planBuild, ROLE_LABELS, type Bearing, type BuildKind, type BuildLine, type BuildPlan } from '../lib/build-parts';
import { show } from '../lib/units';
import { SaveFitmentForm } from './save-fitment-form';
import { StockWord } from './stock-word';
import { VerdictBadge } from './verdict-badge';

const sentence = (s: string) => `${s.charAt(0).toUpperCase()}${s.slice(1)}.`;

/** One row of the sheet: what it is on the left, the choice and its reason on the right. */
function SheetRow({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid gap-x-4 gap-y-1 px-5 py-3 sm:grid-cols-[11rem_minmax(0,1fr)]">
      <dt className="font-semibold text-cast">{label}</dt>
      <dd className="min-w-0">{children}</dd>
    </div>
  );
}

const BEARING_TEXT: Record<Bearing, { label: string; note: string }> = {
  ball: { label: 'Ball bearing', note: 'Spools sooner, and its thrust bearing lasts far longer in hard use.' },
  journal: { label: 'Journal bearing', note: 'The economical choice: costs less; in hard use its thrust bearing wants a freshen-up sooner.' },
};

function BearingChoice({ value, onChange, offered }: { value: Bearing; onChange: (b: Bearing) => void; offered: Bearing[] }) {
  if (offered.length < 2) {
    const only = offered[0] ?? 'journal';
    return (
      <p>
        <span className="font-semibold">{BEARING_TEXT[only].label}</span> — the only bearing this frame is built with.
      </p>
    );
  }
  return (
    <fieldset className="grid gap-2">
      <legend className="sr-only">Bearing</legend>
      {(['ball', 'journal'] as const).map((b) => (
        <label
          key={b}
          className={`flex cursor-pointer gap-3 rounded-md p-3 ring-1 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-temper ${
            value === b ? 'bg-temper-tint ring-2 ring-temper' : 'ring-cast-line hover:ring-temper'
          }`}
        >
          <input type="radio" name="build-bearing" value={b} checked={value === b} onChange={() => onChange(b)} className="mt-1 size-4 shrink-0 accent-temper" />
          <span>
            <span className="font-semibold">
              {BEARING_TEXT[b].label}
              {b === 'ball' ? ' (recommended)' : ' (economical)'}
            </span>
            <span className="block text-sm text-cast">{BEARING_TEXT[b].note}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}

function KindChoice({ value, onChange, turbineAr }: { value: BuildKind; onChange: (k: BuildKind) => void; turbineAr: number }) {
  const options: Array<{ kind: BuildKind; label: string; note: string }> = [
    { kind: 'complete', label: 'Complete turbocharger', note: `Assembled and balanced, with the ${turbineAr.toFixed(2)} A/R turbine housing fitted.` },
    { kind: 'assembled', label: 'Cartridge and housings', note: 'The same build in parts, to put together yourself or in your workshop.' },
  ];
  return (
    <fieldset className="grid gap-2 sm:grid-cols-2">
      <legend className="mb-1 font-semibold">How to buy it</legend>
      {options.map((o) => (
        <label
          key={o.kind}
          className={`flex cursor-pointer gap-3 rounded-md p-3 ring-1 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-temper ${
            value === o.kind ? 'bg-temper-tint ring-2 ring-temper' : 'bg-white ring-cast-line hover:ring-temper'
          }`}
        >
          <input type="radio" name="build-kind" value={o.kind} checked={value === o.kind} onChange={() => onChange(o.kind)} className="mt-1 size-4 shrink-0 accent-temper" />
          <span>
            <span className="font-semibold">{o.label}</span>
            <span className="block text-sm text-cast">{o.note}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}

function PartLine({ line }: { line: BuildLine }) {
  const { part, quantity } = line;
  return (
    <li className="grid gap-x-4 gap-y-0.5 px-3 py-2.5 sm:grid-cols-[minmax(0,1fr)_auto]" data-role={line.role}>
      <div className="min-w-0">
        <p className="flex flex-wrap items-baseline gap-x-3">
          <span className="font-semibold">{ROLE_LABELS[line.role]}</span>
          {part && (
            <Link to={`/parts/${encodeURIComponent(part.partNumber)}`} className="part-no text-temper underline-offset-2 hover:underline">
              {part.partNumber}
            </Link>
          )}
          {part && (
            <span className="text-sm">
              <StockWord stock={part.stock} wanted={quantity} />
            </span>
          )}
        </p>
        {part ? (
          <>
            <p className="text-sm text-cast">{part.title}</p>
            <p className="text-xs text-cast">{sentence(line.why)}</p>
          </>
        ) : (
          <p className="font-semibold text-oxide">Not in the catalogue just now: ask us for this part.</p>
        )}
      </div>
      {part && (
        <p className="tabular whitespace-nowrap sm:self-center sm:text-right">
          <span className="text-cast">
            {quantity} × {formatPrice(part.priceCents)}
          </span>{' '}
          <span className="font-bold">{formatPrice(part.priceCents * quantity)}</span>
        </p>
      )}
    </li>
  );
}

interface BuildPartsProps {
  candidate: FitmentCandidate;
  turbineAr: number;
  plan: BuildPlan;
  onPrefer: (kind: BuildKind) => void;
  request: FitmentRequest;
  signedIn: boolean;
  /** An approved trade account, which may back-order what is short. */
  canBackorder: boolean;
  saved: Pick<SavedFitment, 'id' | 'name'> | null;
  onSaved: (saved: SavedFitment) => void;
  onAddedToCart?: () => unknown;
}

/** The parts to order as one build, from the catalogue, and the one action that puts them all in the cart. */
function BuildParts({ candidate, turbineAr, plan, onPrefer, request, signedIn, canBackorder, saved, onSaved, onAddedToCart }: BuildPartsProps) {
  const units = candidate.layout === 'twin' ? 2 : 1;
  const main = plan.lines[0]?.part ?? null;
  // Gaskets and lines follow the main part's goes-with links in the catalogue.
  const detail = usePart(main?.partNumber ?? null);
  const fittings = detail.data ? fittingLines(detail.data, units) : [];
  const lines = [...plan.lines, ...fittings];
  const missing = lines.filter((l) => l.part === null);
  const signature = lines.map((l) => `${l.part?.partNumber ?? '-'}×${l.quantity}`).join(',');
  const [added, setAdded] = useState<{ signature: string; withCheck: string | null } | null>(null);
  const add = useAddBuildToCart(onAddedToCart);
  const confirmRef = useRef<HTMLDivElement>(null);
  const answered = (added !== null && added.signature === signature) || add.isError;
  useEffect(() => {
    if (answered) confirmRef.current?.scrollIntoView({ block: 'nearest', behavior: 'smooth' });
  }, [answered, added]);

  if (main !== null && detail.isPending) return <LoadingState label="Choosing the gaskets and lines for this build…" />;
  if (detail.isError) return <ErrorState title="The fittings for this build did not load" message={detail.error.message} onRetry={() => void detail.refetch()} />;

  const total = lines.reduce((sum, l) => sum + (l.part ? l.part.priceCents * l.quantity : 0), 0);
  const pieces = lines.reduce((sum, l) => sum + (l.part ? l.quantity : 0), 0);
  const short = lines.filter((l) => l.part && l.part.stock.available < l.quantity);
  const orderable = missing.length === 0 && lines.length > 0;

  return (
    <div className="grid gap-4">
      {plan.completeOffered ? (
        <KindChoice value={plan.kind} onChange={onPrefer} turbineAr={turbineAr} />
      ) : (
        <p className="text-cast">
          No complete {candidate.frameCode} unit is built with the {turbineAr.toFixed(2)} A/R turbine housing, so the build is a cartridge with both housings.
        </p>
      )}

      <ul className="divide-y divide-cast-line rounded-lg bg-white ring-1 ring-cast-line" aria-label="Parts in this build">
        {lines.map((l) => (
          <PartLine key={l.role} line={l} />
        ))}
      </ul>

      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="text-cast">
          {units === 2 ? 'Two of each part, one set per unit. ' : ''}List prices; trade prices, freight by weight and tax are worked out in the cart.
        </p>
        <p className="tabular text-xl font-bold whitespace-nowrap">
          <span className="text-base font-semibold text-cast">Build total </span>
          {formatPrice(total)}
        </p>
      </div>

      {short.length > 0 && (
        <p className="flex gap-2 text-amber">
          <TriangleAlert aria-hidden className="mt-0.5 size-5 shrink-0" />
          <span>
            {short.length === 1 ? `${short[0]!.part!.partNumber} is` : `${short.length} parts are`} short of stock for this build:{' '}
            {canBackorder
              ? 'what is short goes on back-order on your trade account.'
              : 'the cart shows what is available, and checkout waits until the rest is in.'}
          </span>
        </p>
      )}

      <div className="rounded-md bg-panel p-4">
        <SaveFitmentForm request={request} signedIn={signedIn} saved={saved} onSaved={onSaved} />
      </div>

      {orderable ? (
        <div className="grid gap-2">
          <div>
            <Button
              size="lg"
              className="w-full sm:w-auto"
              disabled={add.isPending}
              onClick={() =>
                add.mutate(
                  {
                    lines: lines.map((l) => ({
                      partNumber: l.part!.partNumber,
                      quantity: l.quantity,
                      allowBackorder: canBackorder && l.part!.stock.available < l.quantity,
                    })),
                    fitmentId: saved?.id ?? null,
                  },
                  { onSuccess: () => setAdded({ signature, withCheck: saved?.name ?? null }) },
                )
              }
            >
              <ShoppingCart aria-hidden className="size-5" />
              {add.isPending ? 'Adding the build…' : 'Add the whole build to the cart'}
            </Button>
          </div>
          <p className="text-sm text-cast">
            {pieces} {pieces === 1 ? 'part' : 'parts'} on {lines.length} cart lines{saved ? `, each carrying the check “${saved.name}”` : ''}.
          </p>
          {/* Right under the button, and scrolled to if it lands below the screen's edge: the answer is where the buyer looks. */}
          <div aria-live="polite" ref={confirmRef} className="scroll-mb-4">
            {added && added.signature === signature && (
              <Notice tone="done">
                The build is in your cart: {pieces} {pieces === 1 ? 'part' : 'parts'}
                {added.withCheck ? <>, with the check “{added.withCheck}” attached to every line</> : null}.{' '}
                <Link to="/cart" className="font-semibold text-temper underline underline-offset-2">
                  Go to the cart
                </Link>
              </Notice>
            )}
            {add.isError && (
              <Notice tone="problem" live="alert">
                {add.error.message}
              </Notice>
            )}
          </div>
        </div>
      ) : (
        <p role="note" className="rounded-md bg-oxide-tint p-3 font-semibold text-oxide">
          This build cannot be ordered as one just now: {missing.map((l) => ROLE_LABELS[l.role].toLowerCase()).join(', ')} {missing.length === 1 ? 'is' : 'are'} not in
          the catalogue.
        </p>
      )}

    </div>
  );
}

export interface BuildSheetProps {
  candidate: FitmentCandidate;
  /** The frame's map entry, for its bearing options; undefined while the maps load. */
  frame: FitmentFrameMap | undefined;
  assumptions: FitmentAssumptions;
  request: FitmentRequest;
  /** The check's own recommendation, or a frame the buyer picked from the list. */
  recommended: boolean;
  signedIn: boolean;
  /** An approved trade account, which may back-order what is short. */
  canBackorder: boolean;
  saved: Pick<SavedFitment, 'id' | 'name'> | null;
  onSaved: (saved: SavedFitment) => void;
  onAddedToCart?: () => unknown;
}

/** The answer as a build: frame, layout, bearing, both housings with the spool they give, and the parts to order. */
export function BuildSheet({ candidate: c, frame, assumptions, request, recommended, signedIn, canBackorder, saved, onSaved, onAddedToCart }: BuildSheetProps) {
  const offered: Bearing[] = frame ? (['ball', 'journal'] as const).filter((b) => frame.bearingOptions.includes(b)) : ['ball', 'journal'];
  const [bearing, setBearing] = useState<Bearing>(offered.includes('ball') ? 'ball' : 'journal');
  const [prefer, setPrefer] = useState<BuildKind | undefined>(undefined);
  const turbine = c.turbine;
  const twin = c.layout === 'twin';
  const stock = useBuildParts(c.frameCode, bearing);
  const plan =
    stock.data && turbine
      ? planBuild(
          { frameCode: c.frameCode, layout: c.layout, bearing, turbineAr: turbine.housingAr, application: assumptions.application, turbineInletC: assumptions.turbineInletC, prefer },
          stock.data,
        )
      : null;

  return (
    <section aria-labelledby="build-heading" className="overflow-hidden rounded-lg bg-white shadow-sm ring-1 ring-cast-line" data-testid="build-sheet">
      <header className="grid gap-2 border-b border-cast-line bg-panel/60 px-5 py-4">
        <p className="text-sm font-semibold text-cast">{recommended ? 'Recommended build' : 'Build on the frame you picked'}</p>
        <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
          <h3 id="build-heading" className="text-2xl font-bold">
            <span className="part-no">{c.frameCode}</span> {c.frameName}, {twin ? 'twin turbochargers' : 'single turbocharger'}
          </h3>
          <VerdictBadge verdict={c.verdict} />
        </div>
      </header>

      <dl className="divide-y divide-cast-line/70">
        <SheetRow label="Frame">
          <p>
            <Link to={`/frames/${encodeURIComponent(c.frameCode)}`} className="text-temper underline">
              <span className="part-no">{c.frameCode}</span> {c.frameName}
            </Link>
            <span className="text-cast"> · shaft limit {show.rpm(c.maxShaftRpm)}</span>
          </p>
          {c.reasons[0] && <p className="text-sm text-cast">{sentence(c.reasons[0])}</p>}
        </SheetRow>
        <SheetRow label="Layout">
          <p className="font-semibold">{twin ? 'Twin: two units, each taking half the air' : 'Single: one unit takes all the air'}</p>
          {twin && <p className="text-sm text-cast">Usually one per cylinder bank or manifold; every figure on the map is per unit.</p>}
        </SheetRow>
        <SheetRow label="Bearing">
          <BearingChoice value={bearing} onChange={setBearing} offered={offered} />
        </SheetRow>
        <SheetRow label="Compressor housing">
          {plan?.compressorAr != null ? (
            <p>
              <span className="tabular font-semibold">{plan.compressorAr.toFixed(2)} A/R</span>
              {plan.inducerMm != null && <span className="text-cast">, bored for the {plan.inducerMm} mm inducer</span>}
            </p>
          ) : (
            <p className="text-cast">{stock.isPending ? 'Reading the catalogue…' : 'Not offered for this frame'}</p>
          )}
        </SheetRow>
        <SheetRow label="Turbine housing">
          {turbine ? (
            <>
              <p>
                <span className="tabular font-semibold">{turbine.housingAr.toFixed(2)} A/R</span>
                {plan?.turbineMaterial && <span className="text-cast">, {plan.turbineMaterial}</span>}
              </p>
              <p className="tabular">
                {turbine.fullBoostRpm !== null ? (
                  <>
                    Full boost from <span className="font-semibold">{show.rpm(turbine.fullBoostRpm)}</span>
                  </>
                ) : (
                  'Full boost does not arrive before peak power'
                )}
                {c.boostThresholdRpm !== null && <span className="text-cast">; boost starts to build at about {show.rpm(c.boostThresholdRpm)}</span>}
              </p>
            </>
          ) : (
            <p className="text-cast">We have no turbine housing data for this frame: ask us which to fit.</p>
          )}
        </SheetRow>
      </dl>

      <section aria-labelledby="build-parts-heading" className="grid gap-3 border-t border-cast-line bg-paper/60 p-5">
        <h4 id="build-parts-heading" className="text-xl font-bold">
          Parts to order as one build{twin ? ', for both units' : ''}
        </h4>
        {!turbine ? (
          <p className="text-cast">Without a turbine housing to name, we cannot put this build together here.</p>
        ) : stock.isPending ? (
          <LoadingState label="Choosing the parts for this build…" />
        ) : stock.isError ? (
          <ErrorState title="The parts for this build did not load" message={stock.error.message} onRetry={() => void stock.refetch()} />
        ) : plan ? (
          <BuildParts
            candidate={c}
            turbineAr={turbine.housingAr}
            plan={plan}
            onPrefer={setPrefer}
            request={request}
            signedIn={signedIn}
            canBackorder={canBackorder}
            saved={saved}
            onSaved={onSaved}
            onAddedToCart={onAddedToCart}
          />
        ) : null}
      </section>
    </section>
  );
}
