import { Link } from 'react-router-dom';
import { useFrameParts } from '../api/get-frame-parts';

const LINKED_CATEGORIES = [
  { slug: 'turbochargers', label: 'Complete turbochargers' },
  { slug: 'cartridges', label: 'Cartridges' },
  { slug: 'compressor-housings', label: 'Compressor housings' },
  { slug: 'turbine-housings', label: 'Turbine housings' },
  { slug: 'gaskets-fittings', label: 'Gaskets and fittings' },
  { slug: 'rebuild-kits', label: 'Rebuild kits' },
] as const;

/** Links to everything the catalogue has on a frame, for a buyer who wants other housings or spares than the build. */
export function FrameParts({ frameCode }: { frameCode: string }) {
  const parts = useFrameParts(frameCode);
  const counts = new Map(parts.data?.facets.category.map((f) => [f.value, f.count]) ?? []);
  return (
    <nav aria-labelledby="frame-parts-heading" className="grid gap-2">
      <h3 id="frame-parts-heading" className="text-lg font-bold">
        Everything on frame <span className="part-no">{frameCode}</span>
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
    </nav>
  );
}
