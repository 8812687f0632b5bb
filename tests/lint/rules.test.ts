import fs from 'node:fs';
import path from 'node:path';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

/** The project's own lint rules catch the mistakes they exist for: planted in tests/lint/fixtures (ignored by `eslint .`). */
describe('lint safety nets', () => {
  const root = path.resolve(import.meta.dirname, '../..');
  const eslint = new ESLint({ cwd: root, ignore: false });
  const rulesHit = async (file: string) => {
    const [result] = await eslint.lintFiles([path.join(root, 'tests/lint/fixtures', file)]);
    return (result?.messages ?? []).map((m) => m.ruleId);
  };
  // Path zones depend on where a file sits, so these planted files are linted as if they sat at `lintedAs`.
  const rulesHitAt = async (file: string, lintedAs: string) => {
    const code = fs.readFileSync(path.join(root, 'tests/lint/fixtures', file), 'utf8');
    const [result] = await eslint.lintText(code, { filePath: path.join(root, lintedAs) });
    return (result?.messages ?? []).map((m) => m.ruleId);
  };

  it('finds an import cycle between two TypeScript files', async () => {
    expect(await rulesHit('cycle-a.ts')).toContain('import-x/no-cycle');
  }, 60_000);

  it('finds an import that resolves to nothing', async () => {
    expect(await rulesHit('unresolved.ts')).toContain('import-x/no-unresolved');
  }, 60_000);

  it('keeps services away from the HTTP layer: no imports from server/middleware or server/routes', async () => {
    expect(await rulesHitAt('service-imports-middleware.ts', 'server/services/planted.ts')).toContain('import-x/no-restricted-paths');
    expect(await rulesHitAt('service-imports-route.ts', 'server/services/orders/planted.ts')).toContain('import-x/no-restricted-paths');
    // The same kind of import from the services' own errors module passes, so the rule is not simply refusing everything.
    expect(await rulesHitAt('service-imports-domain-errors.ts', 'server/services/planted.ts')).toEqual([]);
  }, 60_000);
});
