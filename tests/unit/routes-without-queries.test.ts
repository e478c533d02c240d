import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// The layer rule dependency-cruiser cannot see (queries go through the Db object a route is handed,
// not through an import): route files call services and never build a Knex query themselves.
// docs/architecture.md, "routes → services → db/chem, one way".
const serverDir = join(import.meta.dirname, '../../server');
const routeFiles = (readdirSync(serverDir, { recursive: true }) as string[]).filter((f) => f.endsWith('.routes.ts'));
// A query starts with the Db or a transaction called on a table name, or uses Knex's raw/fn helpers.
const query = /\b(?:db|trx|knex)\s*\(\s*['"`]|\.(?:raw|fn\.now)\s*\(|\btransaction\s*\(/;

describe('route files', () => {
  it('are found', () => expect(routeFiles.length).toBeGreaterThan(10));

  it.each(routeFiles)('%s builds no Knex query', (file) => {
    const lines = readFileSync(join(serverDir, file), 'utf8').split('\n');
    const found = lines.map((l, i) => [i + 1, l.trim()] as const).filter(([, l]) => query.test(l));
    expect(found).toEqual([]);
  });
});
