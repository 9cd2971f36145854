import { readdirSync } from 'node:fs';
import path from 'node:path';

/**
 * For the tests that read the project's own source as text: every file under `dir` whose name `keep`
 * accepts, folders named in `skip` left out.
 */
export function sourceFiles(dir: string, keep: (name: string) => boolean, skip: readonly string[] = []): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) {
      if (!skip.includes(entry.name)) out.push(...sourceFiles(full, keep, skip));
    } else if (keep(entry.name)) out.push(full);
  }
  return out;
}

/** The line (from 1) of `text` that character `index` is on. */
export const lineOf = (text: string, index: number) => text.slice(0, index).split('\n').length;
