import { HardHat } from 'lucide-react';
import { useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { normalizeServiceReference, BENCH_QUEUE_KEYS, type BenchQueue } from '../../../shared/service';
import { normalizeSerial } from '../../../shared/unit-serial';
import { buttonClass } from '../../components/ui/button';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useBenchScan } from '../../features/service/api/bench-actions';
import { BenchPage } from '../../features/service/components/bench-page';
import { ScanFeedback, type ScanOutcome } from '../../features/warehouse/components/scan-feedback';
import { ScanField } from '../../features/warehouse/components/scan-field';

/** The Bench's scan: a request label or a unit's serial plate; a booked unit is received by its scan. */
function BenchScan({ onOpen }: { onOpen: (ref: string) => void }) {
  const scan = useBenchScan();
  const [code, setCode] = useState('');
  const [outcome, setOutcome] = useState<ScanOutcome | null>(null);
  const [stamp, setStamp] = useState(0);
  const ref = useRef<HTMLInputElement>(null);
  const answer = (o: ScanOutcome) => {
    setOutcome(o);
    setStamp((n) => n + 1);
  };
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const typed = code.trim();
    setCode('');
    if (!normalizeServiceReference(typed) && !normalizeSerial(typed)) {
      answer({ kind: 'refused', title: typed ? `${typed.slice(0, 30)} is not a request or a serial` : 'Nothing scanned', detail: 'Scan the SR label on the box (SR-7001) or the serial plate (VC26-004217-5).' });
      return;
    }
    scan.mutate(typed, {
      onSuccess: (r) => {
        answer({ kind: 'ok', title: r.action === 'received' ? `${r.reference} received` : `${r.reference} opened`, detail: r.action === 'received' ? 'Marked received; inspect it next.' : r.message });
        onOpen(r.reference);
      },
      onError: (err) => answer({ kind: 'refused', title: 'Refused', detail: err.message }),
    });
  };
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      <form noValidate onSubmit={submit} aria-label="Scan a service request or a unit" className="rounded-lg border-2 border-cast-line bg-white p-4">
        <ScanField ref={ref} id="bench-scan" label="Scan request or serial" value={code} onChange={(e) => setCode(e.target.value)} hint="A booked unit is received by its scan; anything else opens." />
      </form>
      <ScanFeedback outcome={outcome} stamp={stamp} idle="Scan the label on an arriving box, or the serial plate of a unit on the Bench." />
    </div>
  );
}

export function BenchRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const q = params.get('queue') ?? 'booked';
  const queue: BenchQueue = (BENCH_QUEUE_KEYS as readonly string[]).includes(q) ? (q as BenchQueue) : 'booked';
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  const openRef = normalizeServiceReference(params.get('ref') ?? '');
  const set = (next: { queue: BenchQueue; page: number; ref: string | null }) => {
    const p: Record<string, string> = {};
    if (next.queue !== 'booked') p.queue = next.queue;
    if (next.page > 1) p.page = String(next.page);
    if (next.ref) p.ref = next.ref;
    setParams(p);
  };
  if (me.isPending) return <LoadingState label="Checking who is signed in…" />;
  if (me.isError) return <ErrorState message={me.error.message} onRetry={() => void me.refetch()} />;
  const user = me.data.user;
  if (!user || (user.role !== 'workshop' && user.role !== 'admin')) {
    return (
      <section aria-labelledby="bench-closed" className="mx-auto my-10 flex max-w-2xl gap-4 rounded-md border-2 border-cast-line bg-white p-6">
        <HardHat aria-hidden className="size-10 shrink-0 text-cast" />
        <div>
          <h1 id="bench-closed" className="text-2xl font-bold">
            The Bench is for workshop staff
          </h1>
          <p className="mt-2 text-lg">{user ? `You are signed in as ${user.name}. Your own service requests are on the Counter.` : 'Sign in with your workshop account.'}</p>
          <Link to={user ? '/service' : '/sign-in?next=/bench'} className={`${buttonClass('primary', 'lg')} mt-4`}>
            {user ? 'Your service requests' : 'Sign in'}
          </Link>
        </div>
      </section>
    );
  }
  return (
    <div>
      <h1 className="mb-1 text-3xl font-bold">Bench</h1>
      <p className="mb-4 text-lg text-cast">Receive, inspect, quote, rebuild and ship back units booked in for service.</p>
      <BenchPage
        queue={queue}
        page={page}
        openRef={openRef}
        scan={<BenchScan onOpen={(ref) => set({ queue, page, ref })} />}
        onQueue={(qq) => set({ queue: qq, page: 1, ref: openRef })}
        onPage={(p) => set({ queue, page: p, ref: openRef })}
        onOpen={(ref) => set({ queue, page, ref })}
      />
    </div>
  );
}
