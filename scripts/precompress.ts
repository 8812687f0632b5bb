import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Plugin } from 'vite';

/** Text that compresses; images and fonts in their own compressed formats gain nothing. */
const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|txt|map|webmanifest)$/;

/**
 * Writes a brotli (`.br`, quality 11) and a gzip (`.gz`, level 9) beside every compressible file of a built client,
 * when it is smaller than the file. Done once at build time at the strongest settings, so the server sends ready-made
 * bytes instead of compressing the same script on every request.
 */
export function precompress(dir: string): { files: number; rawBytes: number; brBytes: number; gzBytes: number } {
  const totals = { files: 0, rawBytes: 0, brBytes: 0, gzBytes: 0 };
  for (const entry of fs.readdirSync(dir, { recursive: true, withFileTypes: true })) {
    if (!entry.isFile() || !COMPRESSIBLE.test(entry.name)) continue;
    const file = path.join(entry.parentPath, entry.name);
    const raw = fs.readFileSync(file);
    if (raw.length < 1024) continue;
    const br = zlib.brotliCompressSync(raw, {
      params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length },
    });
    const gz = zlib.gzipSync(raw, { level: 9 });
    if (br.length < raw.length) fs.writeFileSync(`${file}.br`, br);
    if (gz.length < raw.length) fs.writeFileSync(`${file}.gz`, gz);
    totals.files += 1;
    totals.rawBytes += raw.length;
    totals.brBytes += Math.min(br.length, raw.length);
    totals.gzBytes += Math.min(gz.length, raw.length);
  }
  return totals;
}

/** The Vite plugin: precompresses the client once the build has written it. */
export function precompressPlugin(): Plugin {
  let outDir = '';
  return {
    name: 'spoolyard-precompress',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    closeBundle() {
      const t = precompress(outDir);
      const kb = (n: number) => `${(n / 1024).toFixed(0)} kB`;
      console.log(`precompressed ${t.files} files: ${kb(t.rawBytes)} → ${kb(t.brBytes)} brotli, ${kb(t.gzBytes)} gzip`);
    },
  };
}
