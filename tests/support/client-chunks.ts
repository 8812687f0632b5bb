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
export function firstPageScripts(clientDir: string): ChunkSize[] {
  const manifest = readManifest(clientDir);
  const html = fs.readFileSync(path.join(clientDir, 'index.html'), 'utf8');
  const files = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\ssrc="\/([^"]+\.js)"/g)) files.add(m[1]!);
  for (const m of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="\/([^"]+\.js)"/g)) files.add(m[1]!);
  const entries = Object.keys(manifest).filter((k) => manifest[k]!.isEntry);
  for (const e of entries) for (const k of staticClosure(manifest, e)) files.add(manifest[k]!.file);
  return [...files].map((file) => ({ file, gzipBytes: gzipBytes(clientDir, file) }));
}

/** The scripts a page's lazy chunk brings beyond the first-page ones: the chunk and its static imports. */
export function pageScripts(clientDir: string, source: string): ChunkSize[] {
  const manifest = readManifest(clientDir);
  if (!manifest[source]) throw new Error(`${source} is not a chunk of the build`);
  const first = new Set(firstPageScripts(clientDir).map((c) => c.file));
  return [...staticClosure(manifest, source)]
    .map((k) => manifest[k]!.file)
    .filter((file) => !first.has(file))
    .map((file) => ({ file, gzipBytes: gzipBytes(clientDir, file) }));
}

export const totalBytes = (chunks: ChunkSize[]) => chunks.reduce((s, c) => s + c.gzipBytes, 0);
export const describeChunks = (chunks: ChunkSize[]) =>
  [...chunks].sort((a, b) => b.gzipBytes - a.gzipBytes).map((c) => `${c.file} ${(c.gzipBytes / 1000).toFixed(1)} kB`).join(', ');
