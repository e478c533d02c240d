import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../helpers/db';
import { migrationSource } from '../../migrations/index';

// The bead type migrations: the size class words (regular / small / tiny) become heavy atoms per bead
// (4 / 3 / 2) without renaming anyone's types, the library gets a note, and both undo cleanly.

let database: TestDatabase;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(() => database.drop());

describe('bead type migrations', () => {
  it('convert stored size classes both ways and keep the type names', async () => {
    const db = database.db;
    await db.migrate.down({ migrationSource, name: '20261205_052_bead_type_library_note' });
    await db.migrate.down({ migrationSource, name: '20261205_051_bead_type_heavy_atoms' });
    const [userId] = await db('users').insert({ email: 'mig@example.org', display_name: 'Mig', is_admin: false, password_hash: 'x' });
    const [projectId] = await db('projects').insert({ name: 'Migrated', description: '', created_by: userId });
    const row = (position: number, name: string, size: string) => ({ project_id: projectId, position, name, size_class: size, charge: 0, delta_g_min: -1, delta_g_max: 1, description: 'ours' });
    await db('bead_types').insert([row(0, 'Our big one', 'regular'), row(1, 'sP9', 'small'), row(2, 'tiny-ish', 'tiny')]);

    await db.migrate.latest({ migrationSource });
    const up = await db('bead_types').where({ project_id: projectId }).orderBy('position').select('name', 'heavy_atoms_per_bead', 'description');
    expect(up).toEqual([
      { name: 'Our big one', heavy_atoms_per_bead: 4, description: 'ours' },
      { name: 'sP9', heavy_atoms_per_bead: 3, description: 'ours' },
      { name: 'tiny-ish', heavy_atoms_per_bead: 2, description: 'ours' },
    ]);
    expect(await db.schema.hasColumn('bead_type_libraries', 'note')).toBe(true);

    await db.migrate.down({ migrationSource, name: '20261205_052_bead_type_library_note' });
    await db.migrate.down({ migrationSource, name: '20261205_051_bead_type_heavy_atoms' });
    const down = await db('bead_types').where({ project_id: projectId }).orderBy('position').select('name', 'size_class');
    expect(down).toEqual([{ name: 'Our big one', size_class: 'regular' }, { name: 'sP9', size_class: 'small' }, { name: 'tiny-ish', size_class: 'tiny' }]);
    expect(await db.schema.hasColumn('bead_types', 'heavy_atoms_per_bead')).toBe(false);
    await db.migrate.latest({ migrationSource });
    expect(await db.schema.hasColumn('bead_types', 'size_class')).toBe(false);
  });
});
