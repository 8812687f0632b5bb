import fs from 'node:fs';
import path from 'node:path';

/**
 * The project's folder: the nearest one above this module that holds package.json. The same whether the server runs
 * from its sources (server/) or from the compiled bundle (dist/server/), so files beside the code — migrations, the
 * built client — are found from either.
 */
function projectRoot(from: string): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${from}`);
  }
}

export const PROJECT_ROOT = projectRoot(import.meta.dirname);
