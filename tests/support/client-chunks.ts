import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/** One chunk of Vite's build manifest (`build.manifest: true`), keyed by its source. */
interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

export interface ChunkSize {
  file: string;
  gzipBytes: number;
}

export function readManifest(clientDir: string): Manifest {
  return JSON.parse(fs.readFileSync(path.join(clientDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
}

const gzipBytes = (clientDir: string, file: string) => zlib.gzipSync(fs.readFileSync(path.join(clientDir, file)), { level: 9 }).length;

/** A chunk and everything it imports statically, as manifest keys. */
function staticClosure(manifest: Manifest, key: string, seen = new Set<string>()): Set<string> {
  if (seen.has(key)) return seen;
  seen.add(key);
  for (const dep of manifest[key]?.imports ?? []) staticClosure(manifest, dep, seen);
  return seen;
}

/**
 * The scripts a first visit needs before any page's own chunk: the entry in index.html, every chunk it imports
 * statically (from the manifest) and whatever index.html preloads, each gzip-compressed (level 9, as precompressed).
 */
export function entryScripts(clientDir: string): ChunkSize[] {
  return [...entryFiles(clientDir, readManifest(clientDir))].map((file) => ({ file, gzipBytes: gzipBytes(clientDir, file) }));
}

function entryFiles(clientDir: string, manifest: Manifest): Set<string> {
  const html = fs.readFileSync(path.join(clientDir, 'index.html'), 'utf8');
  const files = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\ssrc="\/([^"]+\.js)"/g)) files.add(m[1]!);
  for (const m of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="\/([^"]+\.js)"/g)) files.add(m[1]!);
  for (const e of Object.keys(manifest).filter((k) => manifest[k]!.isEntry)) for (const k of staticClosure(manifest, e)) files.add(manifest[k]!.file);
  return files;
}

/**
 * Everything a first visit to a page downloads before the network goes quiet: the entry and its static imports, the
 * page's own chunk and its static imports, and every chunk those import dynamically (the response schemas and the
 * validation library the first requests load beside their answers, illustrations drawn at once ...) with their own
 * imports, again and again. Left out are other pages' chunks and what `onDemand` names: chunks that load only when
 * the visitor does something (a manifest key, or a source whose file name a grouped chunk's key starts with). Whatever
 * is not named counts, so a new dynamic import is counted until someone shows it waits for the visitor.
 */
export function firstVisitScripts(clientDir: string, pageSource: string, onDemand: string[]): ChunkSize[] {
  const manifest = readManifest(clientDir);
  if (!manifest[pageSource]) throw new Error(`${pageSource} is not a chunk of the build`);
  const waits = (key: string) =>
    (key.startsWith('src/app/routes/') && key !== pageSource) ||
    onDemand.some((source) => key === source || key.startsWith(`_${path.basename(source).replace(/\.[jt]sx?$/, '')}-`));
  const keys = new Set<string>();
  const visit = (key: string) => {
    if (keys.has(key) || waits(key)) return;
    keys.add(key);
    const chunk = manifest[key];
    for (const dep of chunk?.imports ?? []) visit(dep);
    for (const dep of chunk?.dynamicImports ?? []) visit(dep);
  };
  for (const k of Object.keys(manifest).filter((k) => manifest[k]!.isEntry)) visit(k);
  visit(pageSource);
  const files = entryFiles(clientDir, manifest);
  for (const k of keys) files.add(manifest[k]!.file);
  return [...files].map((file) => ({ file, gzipBytes: gzipBytes(clientDir, file) }));
}

/** The scripts a page's lazy chunk brings beyond the first-page ones: the chunk and its static imports. */
export function pageScripts(clientDir: string, source: string): ChunkSize[] {
  const manifest = readManifest(clientDir);
  if (!manifest[source]) throw new Error(`${source} is not a chunk of the build`);
  const first = new Set(entryScripts(clientDir).map((c) => c.file));
  return [...staticClosure(manifest, source)]
    .map((k) => manifest[k]!.file)
    .filter((file) => !first.has(file))
    .map((file) => ({ file, gzipBytes: gzipBytes(clientDir, file) }));
}

export const totalBytes = (chunks: ChunkSize[]) => chunks.reduce((s, c) => s + c.gzipBytes, 0);
export const describeChunks = (chunks: ChunkSize[]) =>
  [...chunks].sort((a, b) => b.gzipBytes - a.gzipBytes).map((c) => `${c.file} ${(c.gzipBytes / 1000).toFixed(1)} kB`).join(', ');
