import { X } from 'lucide-react';
import { useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { categoryLabel } from '../../../shared/catalog';
import { PART_SORTS } from '../../../shared/parts-query';
import type { PartsListResponse, PartsQuery } from '../../../shared/schemas/parts';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useParts } from '../../features/catalog/api/get-parts';
import { catalogueQueryFrom } from '../../features/catalog/catalogue-query';
import { PartListItem } from '../../features/catalog/components/part-list-item';

const SORT_LABELS: Record<(typeof PART_SORTS)[number], string> = {
  relevance: 'Best match',
  'price-asc': 'Price, low to high',
  'price-desc': 'Price, high to low',
  number: 'Part number',
  title: 'Name',
};

/** Reads the filters from the URL (the route's loader reads them the same way to fetch the list early). */
function useCatalogueQuery(): [PartsQuery, URLSearchParams, (changes: Record<string, string | null>) => void] {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => catalogueQueryFrom(params), [params]);
  const update = (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(changes)) {
      if (v === null || v === '') next.delete(k);
      else next.set(k, v);
    }
    if (!('page' in changes)) next.delete('page');
    // Synchronously, so a filter control shows its new state at once instead of flicking back while the page updates.
    setParams(next, { flushSync: true });
  };
  return [query, params, update];
}

function FacetGroup({ title, name, options, selected, onSelect }: {
  title: string;
  name: string;
  options: PartsListResponse['facets']['category'];
  selected: string | undefined;
  onSelect: (value: string | null) => void;
}) {
  if (options.length === 0) return null;
  return (
    <fieldset className="border-t border-cast-line pt-3">
      <legend className="font-semibold">{title}</legend>
      <ul className="mt-1 grid gap-0.5">
        <li>
          <label className="flex min-h-8 cursor-pointer items-center gap-2">
            <input type="radio" name={name} checked={!selected} onChange={() => onSelect(null)} className="accent-temper" />
            <span>Any</span>
          </label>
        </li>
        {options.map((o) => (
          <li key={o.value}>
            <label className="flex min-h-8 cursor-pointer items-center gap-2">
              <input type="radio" name={name} checked={selected === o.value} onChange={() => onSelect(o.value)} className="accent-temper" />
              <span className="flex-1">{o.label}</span>
              <span className="tabular text-sm text-cast">{o.count}</span>
            </label>
          </li>
        ))}
      </ul>
    </fieldset>
  );
}

export function CatalogueRoute() {
  const [query, , update] = useCatalogueQuery();
  const [filtersOpen, setFiltersOpen] = useState(false);
  const me = useMe();
  const dealer = me.data?.user?.role === 'dealer' ? me.data.user.dealer : null;
  const tradeTier = dealer?.status === 'approved' ? dealer.tier : null;
  const parts = useParts(query);
  const data = parts.data;
  const page = query.page ?? 1;
  const pageCount = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const heading = query.q ? `Results for “${query.q}”` : query.category ? categoryLabel(query.category) : 'Catalogue';

  const chips: Array<{ key: string; label: string }> = [];
  if (query.category) chips.push({ key: 'category', label: categoryLabel(query.category) });
  if (query.frame) chips.push({ key: 'frame', label: `Frame ${query.frame}` });
  if (query.bearing) chips.push({ key: 'bearing', label: `${query.bearing === 'ball' ? 'Ball' : 'Journal'} bearing` });
  if (query.inStock) chips.push({ key: 'inStock', label: 'In stock' });
  if (query.minHp !== undefined) chips.push({ key: 'minHp', label: `From ${query.minHp} hp` });
  if (query.maxHp !== undefined) chips.push({ key: 'maxHp', label: `Up to ${query.maxHp} hp` });

  return (
    <div className="grid gap-6 lg:grid-cols-[16rem_1fr]">
      <aside aria-label="Filters" className="grid content-start gap-3 lg:sticky lg:top-4">
        <div className="flex items-center justify-between">
          <h2 className="text-lg font-bold">Filter</h2>
          <button
            type="button"
            aria-expanded={filtersOpen}
            aria-controls="catalogue-filters"
            onClick={() => setFiltersOpen((o) => !o)}
            className="min-h-10 rounded border border-cast-line bg-white px-3 font-semibold lg:hidden"
          >
            {filtersOpen ? 'Hide filters' : `Show filters${chips.length ? ` (${chips.length} on)` : ''}`}
          </button>
        </div>
        {data && (
          <div id="catalogue-filters" className={`${filtersOpen ? 'grid' : 'hidden'} gap-3 lg:grid`}>
            <FacetGroup title="Category" name="category" options={data.facets.category} selected={query.category} onSelect={(v) => update({ category: v })} />
            <FacetGroup title="Frame" name="frame" options={data.facets.frame} selected={query.frame} onSelect={(v) => update({ frame: v })} />
            <FacetGroup title="Bearing" name="bearing" options={data.facets.bearing} selected={query.bearing} onSelect={(v) => update({ bearing: v })} />
            <fieldset className="border-t border-cast-line pt-3">
              <legend className="font-semibold">Stock</legend>
              <label className="mt-1 flex min-h-8 cursor-pointer items-center gap-2">
                <input type="checkbox" checked={query.inStock === true} onChange={(e) => update({ inStock: e.target.checked ? 'true' : null })} className="accent-temper" />
                <span className="flex-1">In stock only</span>
                <span className="tabular text-sm text-cast">{data.facets.stock.find((s) => s.value === 'true')?.count ?? 0}</span>
              </label>
            </fieldset>
            <fieldset className="border-t border-cast-line pt-3">
              <legend className="font-semibold">Power band of the frame</legend>
              <div className="mt-1 grid grid-cols-2 gap-2">
                {(['minHp', 'maxHp'] as const).map((key) => (
                  <label key={key} className="text-sm">
                    {key === 'minHp' ? 'From' : 'Up to'}
                    <span className="mt-0.5 flex items-center rounded border border-cast-line bg-white focus-within:border-temper">
                      <input
                        type="number"
                        inputMode="numeric"
                        min={0}
                        max={5000}
                        defaultValue={query[key] ?? ''}
                        key={`${key}-${query[key] ?? ''}`}
                        onBlur={(e) => update({ [key]: e.target.value || null })}
                        onKeyDown={(e) => {
                          if (e.key === 'Enter') update({ [key]: (e.target as HTMLInputElement).value || null });
                        }}
                        className="w-full min-w-0 px-2 py-1.5 tabular"
                      />
                      <span className="pr-2 text-cast">hp</span>
                    </span>
                  </label>
                ))}
              </div>
            </fieldset>
          </div>
        )}
      </aside>

      <section aria-labelledby="results-heading" className="min-w-0">
        {/* On a phone the sort always sits under the heading: whether it fits beside it would change when the web font
            arrives (narrower than the fallback) and move the list below. */}
        <div className="grid gap-3 sm:flex sm:flex-wrap sm:items-end sm:justify-between">
          <div>
            <h1 id="results-heading" className="text-2xl font-bold">
              {heading}
            </h1>
            <p className="text-cast" aria-live="polite">
              {data ? `${data.total.toLocaleString('en-US')} ${data.total === 1 ? 'part' : 'parts'}` : '\u00a0'}
              {parts.isFetching && data ? ' · updating…' : ''}
            </p>
          </div>
          <label className="flex items-center gap-2">
            <span className="text-sm font-semibold">Sort</span>
            <select
              value={query.sort ?? 'relevance'}
              onChange={(e) => update({ sort: e.target.value === 'relevance' ? null : e.target.value })}
              className="min-h-10 rounded border border-cast-line bg-white px-2"
            >
              {PART_SORTS.map((s) => (
                <option key={s} value={s}>
                  {SORT_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
        </div>
        {chips.length > 0 && (
          <ul className="mt-3 flex flex-wrap gap-2" aria-label="Active filters">
            {chips.map((c) => (
              <li key={c.key}>
                <button
                  type="button"
                  onClick={() => update({ [c.key]: null })}
                  className="inline-flex items-center gap-1 rounded-full border border-temper bg-temper-tint px-3 py-1 text-sm font-semibold text-temper-deep"
                >
                  {c.label}
                  <X aria-hidden className="size-3.5" />
                  <span className="sr-only">(remove filter)</span>
                </button>
              </li>
            ))}
          </ul>
        )}

        {parts.isPending ? (
          <LoadingState label="Searching the catalogue…" />
        ) : parts.isError ? (
          <ErrorState title="The catalogue did not load" message={parts.error.message} onRetry={() => parts.refetch()} />
        ) : data && data.items.length === 0 ? (
          <EmptyState title="No parts match">
            {query.q ? <p>Check the part number, try fewer words, or remove a filter.</p> : <p>Remove a filter to see more parts.</p>}
            <Link to="/catalogue" className="font-semibold text-temper underline">
              Clear all filters
            </Link>
          </EmptyState>
        ) : (
          data && (
            <>
              <ul className="mt-2" aria-label="Parts found">
                {data.items.map((p) => (
                  <PartListItem key={p.partNumber} part={p} tradeTier={tradeTier} />
                ))}
              </ul>
              {pageCount > 1 && (
                <nav aria-label="Pages" className="mt-4 flex items-center gap-3">
                  <button
                    type="button"
                    disabled={page <= 1}
                    onClick={() => update({ page: String(page - 1) })}
                    className="min-h-10 rounded border border-cast-line bg-white px-3 font-semibold disabled:opacity-50"
                  >
                    Previous
                  </button>
                  <span className="tabular">
                    Page {page} of {pageCount}
                  </span>
                  <button
                    type="button"
                    disabled={page >= pageCount}
                    onClick={() => update({ page: String(page + 1) })}
                    className="min-h-10 rounded border border-cast-line bg-white px-3 font-semibold disabled:opacity-50"
                  >
                    Next
                  </button>
                </nav>
              )}
            </>
          )
        )}
      </section>
    </div>
  );
}
