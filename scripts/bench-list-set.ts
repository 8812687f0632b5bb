import type Database from 'better-sqlite3';
import type { PartsQuery } from '../shared/schemas/parts';

/**
 * The catalogue lists buyers open most, as the list service takes them: the search-less list, category pages, each
 * filter facet, each sort and mixes of them, a deep page and a word search. The frame is the catalogue's commonest.
 */
export function listSet(sqlite: Database.Database): Array<[string, PartsQuery]> {
  const frame = sqlite.prepare('SELECT frame_code FROM parts WHERE frame_code IS NOT NULL GROUP BY 1 ORDER BY count(*) DESC LIMIT 1').pluck().get() as string;
  return [
    ['search-less list', {}],
    ['category page', { category: 'cartridges' }],
    ['bearing facet', { bearing: 'ball' }],
    ['in stock', { inStock: true }],
    ['frame', { frame }],
    ['power 300-600 hp', { minHp: 300, maxHp: 600 }],
    ['price low-high', { sort: 'price-asc' }],
    ['price high-low', { sort: 'price-desc' }],
    ['part number', { sort: 'number' }],
    ['title', { sort: 'title' }],
    ['category by price', { category: 'turbine-housings', sort: 'price-asc' }],
    ['category by number', { category: 'gaskets-fittings', sort: 'number' }],
    ['category by title', { category: 'compressor-housings', sort: 'title' }],
    ['category + frame', { category: 'cartridges', frame }],
    ['category + bearing + in stock', { category: 'turbochargers', bearing: 'journal', inStock: true, sort: 'price-desc' }],
    ['frame + bearing by price', { frame, bearing: 'ball', sort: 'price-asc' }],
    ['frame + bearing', { frame, bearing: 'journal' }],
    ['category + frame + bearing by title', { category: 'turbochargers', frame, bearing: 'ball', sort: 'title' }],
    ['bearing by price', { bearing: 'ball', sort: 'price-asc' }],
    ['bearing by number', { bearing: 'journal', sort: 'number' }],
    ['bearing by title', { bearing: 'ball', sort: 'title' }],
    ['in stock by price', { inStock: true, sort: 'price-desc' }],
    ['power by price', { minHp: 300, maxHp: 600, sort: 'price-asc' }],
    ['category, page 40', { category: 'turbochargers', page: 40 }],
    ['search "cartridge"', { q: 'cartridge' }],
  ];
}
