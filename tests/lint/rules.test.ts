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

  it('finds an import cycle between two TypeScript files', async () => {
    expect(await rulesHit('cycle-a.ts')).toContain('import-x/no-cycle');
  }, 60_000);

  it('finds an import that resolves to nothing', async () => {
    expect(await rulesHit('unresolved.ts')).toContain('import-x/no-unresolved');
  }, 60_000);
});
