// The demo scenario: an invented research group, its people and molecules.
// Every name here is fictional; the molecules are common textbook compounds.

export const DEMO_PASSWORD = 'beadloom-demo';

export const DEMO_ACCOUNTS = [
  { email: 'admin@example.org', displayName: 'Ada Quill (site admin)', isAdmin: true, role: null },
  { email: 'supervisor@example.org', displayName: 'Dr Ines Marlow', isAdmin: false, role: 'supervisor' },
  { email: 'modeller@example.org', displayName: 'Tomas Brenn', isAdmin: false, role: 'modeller' },
  { email: 'student@example.org', displayName: 'Lea Okafor', isAdmin: false, role: 'student' },
] as const;

export const DEMO_PROJECT = {
  name: 'Micelle formers',
  description:
    'Eastmere University soft-matter group (a fictional demo group): coarse-grained mappings of a non-ionic surfactant, a common drug and a small aromatic for a mixed-micelle study.',
};

export const DEMO_MOLECULES = [
  {
    name: 'Tetraethylene glycol monododecyl ether (C12E4)',
    smiles: 'CCCCCCCCCCCCOCCOCCOCCOCCO',
    notes: 'Non-ionic surfactant: a C12 tail and four ethylene-oxide units.',
  },
  {
    name: 'Ibuprofen',
    smiles: 'CC(C)Cc1ccc(cc1)C(C)C(=O)O',
    notes: 'Common drug; the carboxylic acid is drawn neutral.',
  },
  {
    name: 'Anisole',
    smiles: 'COc1ccccc1',
    notes: 'Small aromatic solute.',
  },
] as const;
