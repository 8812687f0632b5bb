import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { precompressPlugin } from './scripts/precompress';

// Not the sign-up schema: it brings the password-strength dictionary (a quarter of a megabyte).
const SHARED = /[\\/]node_modules[\\/]zod[\\/]|[\\/]shared[\\/](schemas[\\/]|(allowed-values|catalog|format|part-number|pricing|units|part-illustration|exploded-view|ageing|price-import-flags|gtin|scan-code|service|unit-serial)\.ts$)/;
// Of those, what the shop's first pages read (the header's account and cart, parts, frames, the fitment maps, errors)
// with the small rules they import; the Floor's, Office's, Bench's and trade tools' schemas wait in a chunk of their own.
const SHARED_FIRST = /[\\/]node_modules[\\/]zod[\\/]|[\\/]shared[\\/](schemas[\\/](errors|accounts|account-replies|paging|orders|parts|parts-lists|saved-fitments|compressor-map|fitment|notices|mail-outbox)\.ts$|(allowed-values|catalog|format|part-number|pricing|units|part-illustration|exploded-view|gtin)\.ts$)/;
const BLOCKS = /[\\/]src[\\/](components[\\/](ui|illustrations)|lib|features[\\/]([\w-]+[\\/](api[\\/]|[\w-]+\.ts$)|catalog[\\/]components|cart[\\/](components[\\/]quantity-stepper|lib[\\/])))/;
// The blocks of the Floor, Office, Bench and the account's own pages (orders, returns, units, service): kept apart
// from the shop's, so the first page does not bring them (nor their schemas).
const TOOL_BLOCKS = /[\\/]src[\\/]features[\\/](?!(catalog|cart|auth|fitment|notices|lists)[\\/])[\w-]+[\\/]/;
// The blocks that show parts (drawings, list rows, specs, the quantity stepper): the catalogue and part pages need
// them, the home page and the fitment form do not.
const PART_BLOCKS = /[\\/]src[\\/](components[\\/]illustrations|features[\\/](catalog[\\/]components|cart|lists)[\\/])/;
// Forms, tables, dialogs and menus bring libraries of their own (form state, tables, accessible overlays, the card form).
const HEAVY_BLOCKS = /[\\/]ui[\\/](form|sort-header|table|error-summary|part-search-box)\.|(form|table|dialog|menu|live-card|mail-inbox|-page)\.tsx$/;
// Loaded on demand where it is shown (React.lazy), never as a block a page waits for.
const ON_DEMAND = /[\\/]illustrations[\\/]exploded-view\.tsx$/;

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss(), precompressPlugin()],
  build: {
    outDir: 'dist/client',
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
            { name: 'icons', test: /[\\/]node_modules[\\/]lucide-react[\\/]/, minShareCount: 2, priority: 30 },
            // The validation library with the schemas and the small shared rules: every page reads its data through them.
            { name: 'shared', test: (id) => SHARED_FIRST.test(id), priority: 21 },
            { name: 'schemas', test: (id) => SHARED.test(id) && !/sign-up\.ts$/.test(id), priority: 20 },
            // Small building blocks several pages use; not the ones that bring a library of their own (forms, tables).
            { name: 'part-blocks', test: (id) => PART_BLOCKS.test(id) && BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id), minShareCount: 2, priority: 12 },
            { name: 'blocks', test: (id) => BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id) && !TOOL_BLOCKS.test(id), minShareCount: 2, priority: 11 },
            { name: 'tool-blocks', test: (id) => BLOCKS.test(id) && !HEAVY_BLOCKS.test(id) && !ON_DEMAND.test(id), minShareCount: 2, priority: 10 },
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
