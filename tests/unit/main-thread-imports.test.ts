import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// The server's main thread must not load the chemistry libraries (DEVELOPERS.md, "Heavy work off the
// main thread"): they cost ~30 MB per copy and the worker threads hold their own. This walks the
// import graph from server/index.ts — static and dynamic imports that load code, not `import type` —
// and lists every path that reaches openchemlib or RDKit. Worker modules are started from URLs
// (`new URL('./x-worker.ts', import.meta.url)`), not imported, so they are outside the graph.

const ROOT = resolve(__dirname, '../..');
const FORBIDDEN = ['openchemlib', '@rdkit/rdkit'];
const IMPORT = /(?:^|[^\w.])(?:import|export)\s+(?!type\s)(?:[\w*{}\s,$]+?\s+from\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;

function resolveLocal(from: string, spec: string): string | null {
  const base = resolve(dirname(from), spec);
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, join(base, 'index.ts')]) if (existsSync(candidate) && candidate.match(/\.tsx?$/)) return candidate;
  return null;
}

function pathsToForbidden(entry: string): string[] {
  const found: string[] = [];
  const seen = new Set<string>();
  const walk = (file: string, trail: string[]) => {
    if (seen.has(file)) return;
    seen.add(file);
    const source = readFileSync(file, 'utf8');
    for (const m of source.matchAll(IMPORT)) {
      const spec = m[1] ?? m[2];
      if (FORBIDDEN.some((f) => spec === f || spec.startsWith(`${f}/`))) found.push([...trail, relative(ROOT, file), spec].join(' → '));
      else if (spec.startsWith('.')) {
        const next = resolveLocal(file, spec);
        if (next) walk(next, [...trail, relative(ROOT, file)]);
      }
    }
  };
  walk(entry, []);
  return found;
}

describe('the server main thread', () => {
  it('imports neither openchemlib nor RDKit', () => {
    expect(pathsToForbidden(join(ROOT, 'server/index.ts'))).toEqual([]);
  });

  it('is checked by a walk that does find them where they are loaded', () => {
    // The parse worker loads both; if the walk missed them there, the check above would prove nothing.
    const hits = pathsToForbidden(join(ROOT, 'server/workers/parse-worker.ts'));
    expect(hits.some((h) => h.endsWith('openchemlib'))).toBe(true);
    expect(hits.some((h) => h.endsWith('@rdkit/rdkit'))).toBe(true);
  });
});
