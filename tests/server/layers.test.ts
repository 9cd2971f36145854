import { readFileSync } from 'node:fs';
import path from 'node:path';
import { lineOf, sourceFiles } from '../helpers/source-files';

/**
 * The arrows of the layout run one way: the app's code (routes, screens, hooks, lib) and the
 * database's schema and contracts never import the server. A screen that reached into server/ would
 * bundle server code into the web app; a contract that did would tie the API's shapes to its insides.
 */
const root = path.join(__dirname, '..', '..');
const guarded = ['app', 'components', 'hooks', 'lib', 'db', 'constants'];
// Generated SQL and installed packages: no source of ours.
const skipped = ['migrations', 'node_modules'];

/** Every module a file names in `import … from`, `export … from`, `import()` or `require()`. */
function importedSpecifiers(text: string): { spec: string; line: number }[] {
  const found: { spec: string; line: number }[] = [];
  const pattern = /(?:\bfrom\s*|\bimport\s*\(\s*|\brequire\s*\(\s*|^\s*import\s+)['"]([^'"]+)['"]/gm;
  for (const m of text.matchAll(pattern)) {
    found.push({ spec: m[1], line: lineOf(text, m.index) });
  }
  return found;
}

/** Whether `spec`, named in `file`, resolves into server/. */
function reachesServer(file: string, spec: string): boolean {
  let target: string;
  if (spec.startsWith('@/')) target = path.join(root, spec.slice(2));
  else if (spec.startsWith('.')) target = path.resolve(path.dirname(file), spec);
  else return false;
  const rel = path.relative(root, target).split(path.sep);
  return rel[0] === 'server';
}

describe('the layers', () => {
  it('finds the imports it looks for (the scan itself works)', () => {
    const sample = `import { a } from '@/server/x';\nexport type { B } from '../../server/engineering';\nconst c = require('./y');`;
    expect(importedSpecifiers(sample).map((s) => s.spec)).toEqual(['@/server/x', '../../server/engineering', './y']);
    expect(reachesServer(path.join(root, 'db', 'contracts', 'x.ts'), '../../server/engineering')).toBe(true);
    expect(reachesServer(path.join(root, 'components', 'x.tsx'), '@/db/contracts')).toBe(false);
  });

  it('keeps server/ out of the app, the hooks, lib and the database schema and contracts', () => {
    const offenders: string[] = [];
    for (const dir of guarded) {
      for (const file of sourceFiles(path.join(root, dir), (name) => /\.(ts|tsx|js|mjs)$/.test(name), skipped)) {
        for (const { spec, line } of importedSpecifiers(readFileSync(file, 'utf8'))) {
          if (reachesServer(file, spec)) offenders.push(`${path.relative(root, file)}:${line} imports ${spec}`);
        }
      }
    }
    expect(offenders).toEqual([]);
  });
});
