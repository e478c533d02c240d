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

/** One mapping in progress per demo molecule (atom indices follow the chemistry core's order). */
export const DEMO_MAPPINGS: Record<(typeof DEMO_MOLECULES)[number]['name'], { name: string; resolution: '4:1' | '3:1' | '2:1'; description: string; beads: { id: string; name: string; type?: string; atoms: [number, number][] }[] }> = {
  'Tetraethylene glycol monododecyl ether (C12E4)': {
    name: 'C12E4 at 4:1',
    resolution: '4:1',
    description: 'Tail done; two of the four ethylene-oxide units mapped so far.',
    beads: [
      { id: 'demo-c12-t1', name: 'T1', type: 'oil-loving 3, 4 atoms', atoms: [[0, 1], [1, 1], [2, 1], [3, 1]] },
      { id: 'demo-c12-t2', name: 'T2', type: 'oil-loving 3, 4 atoms', atoms: [[4, 1], [5, 1], [6, 1], [7, 1]] },
      { id: 'demo-c12-t3', name: 'T3', atoms: [[8, 1], [9, 1], [10, 1], [11, 1]] },
      { id: 'demo-c12-e1', name: 'E1', atoms: [[12, 1], [13, 1], [14, 1]] },
      { id: 'demo-c12-e2', name: 'E2', atoms: [[15, 1], [16, 1], [17, 1]] },
    ],
  },
  Ibuprofen: {
    name: 'Ibuprofen, ring first',
    resolution: '3:1',
    description: 'Isobutyl and ring beads placed; the propionic acid is still open.',
    beads: [
      { id: 'demo-ibu-tail', name: 'TL', atoms: [[0, 1], [1, 1], [2, 1], [3, 1]] },
      { id: 'demo-ibu-r1', name: 'R1', atoms: [[4, 1], [5, 1], [6, 1]] },
      { id: 'demo-ibu-r2', name: 'R2', atoms: [[7, 1], [8, 1], [9, 1]] },
    ],
  },
  Anisole: {
    name: 'Anisole at 2:1',
    resolution: '2:1',
    description: 'The ipso carbon is shared half-and-half between the methoxy and the first ring bead.',
    beads: [
      { id: 'demo-ani-m', name: 'OM', atoms: [[0, 1], [1, 1], [2, 0.5]] },
      { id: 'demo-ani-r1', name: 'R1', atoms: [[2, 0.5], [3, 1], [4, 1]] },
      { id: 'demo-ani-r2', name: 'R2', atoms: [[5, 1], [6, 1], [7, 1]] },
    ],
  },
};
