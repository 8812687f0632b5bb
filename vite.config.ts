import fs from 'node:fs';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { precompressPlugin } from './scripts/precompress';
import { preloadFontsPlugin } from './scripts/preload-fonts';

// Not the sign-up schema: it brings the password-strength dictionary (a quarter of a megabyte).
const SHARED = /[\\/]node_modules[\\/]zod[\\/]|[\\/]shared[\\/](schemas[\\/]|(allowed-values|catalog|format|order-limits|part-number|parts-query|pricing|units|part-illustration|exploded-view|ageing|price-import-flags|gtin|scan-code|service|unit-serial)\.ts$)/;
// Of those, the schemas of the shop's pages (the answers to what a visitor does there, the forms) with the allowed
// values they are built from; the Floor's, Office's, Bench's and trade tools' schemas wait in a chunk of their own.
// The first answers are read without them.
const SHARED_FIRST = /[\\/]node_modules[\\/]zod[\\/]|[\\/]shared[\\/](schemas[\\/](errors|accounts|account-replies|paging|orders|parts|parts-lists|saved-fitments|compressor-map|fitment|notices|mail-outbox)|allowed-values|gtin)\.ts$/;
// The small rules the first pages use without the validation library (names, prices, formats, drawings). Not the
// allowed values' lists and labels, which only the Floor's, Office's and order pages' blocks read.
const RULES = /[\\/]shared[\\/](catalog|format|order-limits|part-number|parts-query|pricing|part-illustration|exploded-view)\.ts$/;
const BLOCKS = /[\\/]src[\\/](components[\\/](ui|illustrations)|lib|features[\\/]([\w-]+[\\/](api[\\/]|[\w-]+\.ts$)|catalog[\\/]components|cart[\\/](components[\\/]quantity-stepper|lib[\\/])))/;
// The blocks of the Floor, Office, Bench and the account's own pages (orders, returns, units, service): kept apart
// from the shop's, so the first page does not bring them (nor their schemas).
const TOOL_BLOCKS = /[\\/]src[\\/]features[\\/](?!(catalog|cart|auth|fitment|notices|lists)[\\/])[\w-]+[\\/]/;
// The blocks that show parts (drawings, list rows, specs, the quantity stepper): the catalogue and part pages need
// them, the home page and the fitment form do not.
const PART_BLOCKS = /[\\/]src[\\/](components[\\/]illustrations|features[\\/](catalog[\\/]components|cart|lists)[\\/])/;
// Forms, tables, dialogs and menus bring libraries of their own (form state, tables, accessible overlays, the card form).
const HEAVY_BLOCKS = /[\\/]ui[\\/](form|sort-header|table|error-summary|part-search-box)\.|(form|table|dialog|menu|live-card|mail-inbox|-page)\.tsx$/;
// The icons of the shop's first pages (beyond the header's, which stay with the entry): with the blocks those pages
// share, rather than in the chunk of every icon the app draws. The budget test finds one that is missing here.
const FIRST_ICONS = /[\\/]lucide-react[\\/].*[\\/]icons[\\/](gauge|x|arrow-right|circle-check|clock|ban|triangle-alert|triangle-exclamation-point|minus|plus|chevron-right)\.m?js$/;
// Small blocks the first pages do not use (paging, labels, notices, the statuses of orders and the Floor, sign-in's
// words and the roles' names, the trade lists' requests).
const LATER_BLOCKS = /[\\/]src[\\/](components[\\/]ui[\\/](pager|page-nav|parcel-label|orientation-note|status-looks|status-badge|notice)\.tsx?|features[\\/](auth[\\/](auth-errors|roles)|lists[\\/]api[\\/][\w-]+)\.ts)$/;
const FITMENT_BLOCKS = /[\\/]src[\\/]features[\\/]fitment[\\/](api[\\/]|lib[\\/]|components[\\/]unit-switch\.tsx$)|[\\/]shared[\\/](units|fitment[\\/](limits|defaults|airflow))\.ts$/;
// The query library beyond what the entry needs (its mutations).
const QUERY_LIBRARY = /[\\/]node_modules[\\/]@tanstack[\\/](react-query|query-core)[\\/]/;
// Blocks that read with the validation library (they import it or a schema, at once or on demand) stay with the pages
// that use them, never in a block the first pages share: those read their first answers without it.
const validating = new Map<string, boolean>();
function validates(id: string): boolean {
  const file = id.split('?')[0]!;
  if (!/[\\/]src[\\/]/.test(file) || /node_modules/.test(file) || !/\.tsx?$/.test(file)) return false;
  let hit = validating.get(file);
  if (hit === undefined) {
    const code = fs.readFileSync(file, 'utf8');
    hit = /^(import (?!type\b)|export \{)[^;]*from '(zod|[./]+shared\/schemas\/[^']+)'|import\('[./]+shared\/schemas\//m.test(code);
    validating.set(file, hit);
  }
  return hit;
}
// Loaded on demand where it is shown (React.lazy), never as a block a page waits for.
const ON_DEMAND = /[\\/]illustrations[\\/]exploded-view\.tsx$/;

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss(), preloadFontsPlugin(), precompressPlugin()],
  build: {
    outDir: 'dist/client',
    // Every browser we serve preloads modules itself (modulepreload); the polyfill would be in every first visit's script.
    modulePreload: { polyfill: false },
    emptyOutDir: true,
    rolldownOptions: {
      output: {
        // Pages share many small modules; left alone each becomes its own chunk of a few hundred bytes, and a first
        // visit waits on a dozen of them. Grouped, a page is its own chunk plus a few shared ones.
        codeSplitting: {
          // A group takes the modules it names, not everything they import.
          includeDependenciesRecursively: false,
          groups: [
            // What the entry needs stays with the entry: nothing of it waits in a group a page also needs.
            { name: 'index', test: /./, tags: ['$initial'], priority: 50 },
            // Every other icon two or more chunks use in one file (a few hundred bytes each); one page's own icon goes with it.
            { name: 'icons', test: (id) => /[\\/]node_modules[\\/]lucide-react[\\/]/.test(id) && !FIRST_ICONS.test(id), minShareCount: 2, priority: 30 },
            // The small shared rules (names, prices, formats, drawings), without the validation library.
            { name: 'rules', test: (id) => RULES.test(id), priority: 22 },
            // The validation library with the schemas: forms, and the answers to what a visitor does, read through them.
            { name: 'shared', test: (id) => SHARED_FIRST.test(id), priority: 21 },
            { name: 'schemas', test: (id) => SHARED.test(id) && !/sign-up\.ts$/.test(id), priority: 20 },
            // Small building blocks several pages use; not the ones that bring a library of their own (forms, tables).
            // The fitment check's own requests, units (and their switch), limits and defaults: the fitment pages need
            // them, the other first pages do not.
            { name: 'fitment-blocks', test: (id) => FITMENT_BLOCKS.test(id) && !validates(id), minShareCount: 2, priority: 23 },
            { name: 'part-blocks', test: (id) => PART_BLOCKS.test(id) && BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id) && !LATER_BLOCKS.test(id) && !validates(id), minShareCount: 2, priority: 12 },
            // With them, the query library's mutations and the first pages' icons: a few hundred bytes each, not worth a request.
            {
              name: 'blocks',
              test: (id) =>
                (BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id) && !TOOL_BLOCKS.test(id) && !LATER_BLOCKS.test(id) && !validates(id)) ||
                QUERY_LIBRARY.test(id) ||
                FIRST_ICONS.test(id),
              minShareCount: 2,
              priority: 11,
            },
            { name: 'later-blocks', test: (id) => LATER_BLOCKS.test(id), minShareCount: 2, priority: 11 },
            { name: 'tool-blocks', test: (id) => BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id) && !/part-suggestions\.ts$/.test(id), minShareCount: 2, priority: 10 },
          ],
        },
      },
    },
  },
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
});
