// Compiles the server ahead of time for `npm start`: transpiling TypeScript and resolving hundreds of package files at
// start-up were most of the server's start-up time. Two bundles: dist/server/index.mjs (the app; also what each cluster
// worker runs) and dist/server/start.mjs (the local fakes and demo data, then the app); beside them
// dist/server/search-worker.mjs, which the app starts in a worker thread to rebuild its search index.
import path from 'node:path';
import { build, type Plugin } from 'esbuild';

const root = path.resolve(import.meta.dirname, '..');

/** start.ts imports the app by its source path; the start bundle imports the app bundle beside it instead. */
const appBesideStart: Plugin = {
  name: 'app-beside-start',
  setup(b) {
    b.onResolve({ filter: /^\.\.\/server\/index$/ }, () => ({ path: './index.mjs', external: true }));
  },
};

export async function buildServer(outdir = path.join(root, 'dist', 'server')) {
  const started = Date.now();
  await build({
    absWorkingDir: root,
    entryPoints: { index: 'server/index.ts', start: 'scripts/start.ts', 'search-worker': 'server/services/search-worker.ts' },
    outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    // Packages are bundled too (resolving and reading hundreds of module files was most of what start-up had left),
    // except the native SQLite driver and the dev-only tools.
    external: ['better-sqlite3', 'vite', 'lightningcss', 'fsevents'],
    banner: { js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);" },
    platform: 'node',
    format: 'esm',
    target: 'node20',
    sourcemap: true,
    logLevel: 'warning',
    plugins: [appBesideStart],
  });
  return { outdir, ms: Date.now() - started };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { outdir, ms } = await buildServer();
  console.log(`server compiled to ${path.relative(root, outdir)} in ${ms} ms`);
}
