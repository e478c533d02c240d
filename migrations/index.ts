import type { Knex } from 'knex';
import * as m001 from './20261201_001_users';
import * as m002 from './20261201_002_sessions';
import * as m003 from './20261201_003_projects';
import * as m004 from './20261201_004_password_tokens';
import * as m005 from './20261201_005_dev_mail';
import * as m006 from './20261201_006_molecules';
import * as m007 from './20261202_007_molecule_models';
import * as m008 from './20261202_008_mappings';
import * as m009 from './20261202_009_mapping_drafts';
import * as m010 from './20261202_010_bead_types';
import * as m021 from './20261203_021_threads';
import * as m022 from './20261203_022_threads_notifications';
import * as m031 from './20261204_031_mapping_versions';
import * as m032 from './20261204_032_mapping_locks';
import * as m033 from './20261204_033_mapping_audit';
import * as m041 from './20261205_041_audit_import';
import * as m051 from './20261205_051_bead_type_heavy_atoms';
import * as m052 from './20261205_052_bead_type_library_note';
import * as m061 from './20261206_061_references';
import * as m062 from './20261206_062_analyses';
import * as m071 from './20261206_071_bead_type_nonbonded';

// Knex migrations, in order. A new migration is a new file here plus one line below;
// listing them (instead of a folder scan) lets tsx, vitest and the bundler load them alike.
const migrations: Record<string, Knex.Migration> = {
  '20261201_001_users': m001,
  '20261201_002_sessions': m002,
  '20261201_003_projects': m003,
  '20261201_004_password_tokens': m004,
  '20261201_005_dev_mail': m005,
  '20261201_006_molecules': m006,
  '20261202_007_molecule_models': m007,
  '20261202_008_mappings': m008,
  '20261202_009_mapping_drafts': m009,
  '20261202_010_bead_types': m010,
  '20261203_021_threads': m021,
  '20261203_022_threads_notifications': m022,
  '20261204_031_mapping_versions': m031,
  '20261204_032_mapping_locks': m032,
  '20261204_033_mapping_audit': m033,
  '20261205_041_audit_import': m041,
  '20261205_051_bead_type_heavy_atoms': m051,
  '20261205_052_bead_type_library_note': m052,
  '20261206_061_references': m061,
  '20261206_062_analyses': m062,
  '20261206_071_bead_type_nonbonded': m071,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
