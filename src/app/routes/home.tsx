import { Gauge } from 'lucide-react';
import { Link } from 'react-router-dom';
import { CATEGORIES } from '../../../shared/catalog';
import { LoadingState, ErrorState } from '../../components/ui/states';
import { buttonClass } from '../../components/ui/button';
import { TableFrame, Td, Th } from '../../components/ui/table-frame';
import { useFrames } from '../../features/catalog/api/get-frames';

export function HomeRoute() {
  const frames = useFrames();
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-10">
      <section className="grid gap-6 rounded-lg bg-white p-6 shadow-sm ring-1 ring-cast-line md:grid-cols-[3fr_2fr]">
        <div>
          <h1 className="text-3xl font-bold leading-tight">Turbo parts, checked to fit before you buy.</h1>
          <p className="mt-2 text-lg text-cast">
            Complete turbochargers new and on exchange, cartridges, housings, gaskets, lines and gauges from the Vanecraft range. Search by
            part number — ours, an earlier one or a cross-reference — or by words.
          </p>
          <div className="mt-4 flex flex-wrap gap-3">
            <Link to="/catalogue" className={buttonClass('primary', 'lg')}>
              Browse the catalogue
            </Link>
            <Link to="/fitment" className={buttonClass('secondary', 'lg')}>
              <Gauge aria-hidden className="size-5" />
              Check fitment for an engine
            </Link>
          </div>
        </div>
        <div className="rounded-md bg-temper-tint p-4">
          <h2 className="text-lg font-bold text-temper-deep">Fitment check</h2>
          <p className="mt-1">
            Tell us the engine size, the power you want, fuel, peak-power rpm and what the vehicle is for. We work out the air flow and
            boost it needs and show which frames fit, on the compressor map.
          </p>
          <Link to="/fitment" className="mt-3 inline-block font-semibold text-temper underline underline-offset-2">
            Start a fitment check
          </Link>
        </div>
      </section>

      <section aria-labelledby="categories-heading">
        <h2 id="categories-heading" className="text-2xl font-bold">
          Shop by category
        </h2>
        <ul className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {CATEGORIES.map((c) => (
            <li key={c.slug}>
              <Link to={`/catalogue?category=${c.slug}`} className="block h-full rounded-md border border-cast-line bg-white p-4 hover:border-temper">
                <span className="text-lg font-semibold text-temper">{c.label}</span>
                <span className="mt-1 block text-cast">{c.blurb}</span>
              </Link>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="frames-heading">
        <h2 id="frames-heading" className="text-2xl font-bold">
          Vanecraft frames
        </h2>
        <p className="text-cast">Each frame is a size family: housings, cartridges and gaskets of a frame fit together.</p>
        {frames.isPending ? (
          <LoadingState label="Loading frames…" />
        ) : frames.isError ? (
          <ErrorState message={frames.error.message} onRetry={() => frames.refetch()} />
        ) : (
          <TableFrame className="mt-3">
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Frames and their ratings</caption>
              <thead className="bg-panel text-sm">
                <tr>
                  <Th>Frame</Th>
                  <Th numeric>Power band</Th>
                  <Th numeric>Max flow</Th>
                  <Th numeric>Inducer / exducer</Th>
                  <Th numeric>Max shaft speed</Th>
                  <Th numeric>Weight</Th>
                </tr>
              </thead>
              <tbody>
                {frames.data.items.map((f) => (
                  <tr key={f.code} className="border-t border-cast-line">
                    <Th scope="row" className="border-b-0 font-normal">
                      <Link to={`/catalogue?frame=${f.code}`} className="font-semibold text-temper hover:underline">
                        {f.code} {f.name}
                      </Link>
                    </Th>
                    <Td numeric>
                      {f.powerBandHp[0]}–{f.powerBandHp[1]} hp
                    </Td>
                    <Td numeric>{f.maxFlowLbMin} lb/min</Td>
                    <Td numeric>
                      {f.inducerMm} / {f.exducerMm} mm
                    </Td>
                    <Td numeric>{f.maxShaftRpm.toLocaleString('en-US')} rpm</Td>
                    <Td numeric>{f.weightKg} kg</Td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
        )}
      </section>
    </div>
  );
}
