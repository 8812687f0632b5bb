import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { generateCatalogue, type CatalogueSeed } from '../../catalog-seed/generate';
import { FRAME_CODE_PATTERN, PART_NUMBER_PATTERN } from '../../shared/part-number';

/** The team's name guard, beside the checkout; it reads text files and flags real makers' and models' names. */
const TOOL = path.resolve(import.meta.dirname, '../../../shared/tools/realname-check');
const folder = mkdtempSync(path.join(tmpdir(), 'spoolyard-names-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** Everything the app shows of a catalogue, a few thousand parts a file (the tool skips files over 2 MB). */
function writeOut(name: string, c: CatalogueSeed): void {
  const frames = c.frames.map((f) => [f.code, f.name, f.flangePattern].join('\n')).join('\n');
  writeFileSync(path.join(folder, `${name}-frames.txt`), frames);
  for (let i = 0; i < c.parts.length; i += 4000) {
    const text = c.parts
      .slice(i, i + 4000)
      .map((p) =>
        [
          p.partNumber,
          p.title,
          p.description,
          p.frameCode ?? '',
          p.supersededBy ?? '',
          ...p.aliases.map((a) => `${a.alias} ${a.source}`),
          ...Object.values(p.specs).map(String),
          ...p.stock.map((s) => s.binCode),
        ].join('\n'),
      )
      .join('\n');
    writeFileSync(path.join(folder, `${name}-parts-${i / 4000}.txt`), text);
  }
}

function runGuard(dir: string): { ok: boolean; output: string } {
  try {
    return { ok: true, output: execFileSync('python3', [TOOL, '--text', dir], { encoding: 'utf8' }) };
  } catch (e) {
    const err = e as { status?: number; stdout?: string };
    return { ok: false, output: `${err.stdout ?? ''} (exit ${String(err.status)})` };
  }
}

describe('generated catalogue names', () => {
  const demo = generateCatalogue();
  const bench = generateCatalogue({ parts: 50_000 });

  it('use our own schemes: three-letter frame codes, letters and digits never in one group', () => {
    for (const f of demo.frames) expect(f.code, f.name).toMatch(FRAME_CODE_PATTERN);
    for (const p of [...demo.parts, ...bench.parts]) {
      expect(p.partNumber).toMatch(PART_NUMBER_PATTERN);
      // No letter directly followed by a digit, nor a digit by a letter, anywhere in a number.
      expect(p.partNumber).not.toMatch(/[A-Z]\d|\d[A-Z]/);
    }
  });

  it('carry no real maker or model name, checked by the team guard on what the app shows', (ctx) => {
    if (!existsSync(TOOL)) {
      ctx.skip(`The name guard ${TOOL} is absent (the team handbook is not beside this checkout): not checked.`);
      return;
    }
    writeOut('demo', demo);
    writeOut('bench', bench);
    const { ok, output } = runGuard(folder);
    expect(ok, output).toBe(true);
  }, 120_000);
});
