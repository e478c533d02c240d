import { describe, expect, it } from 'vitest';
import { screenInput, SCREEN_LIMITS } from '../../server/workers/screen-input';

// The screen in front of openchemlib (issue 11, item 3) must let real molecules through, up to a few
// thousand heavy atoms, and stop text that only names absurd numbers of atoms or ring bonds.

const passes = (smiles: string) => expect(() => screenInput({ smiles })).not.toThrow();

describe('screenInput', () => {
  it('passes real molecules: caffeine, a fullerene cage, a 2,000-atom polystyrene', () => {
    passes('Cn1cnc2c1c(=O)n(C)c(=O)n2C');
    // A C60-style cage string, written from memory: only how many atoms and ring labels it has matters here.
    passes('c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41');
    passes('C' + 'CC(c1ccccc1)'.repeat(250) + 'C');
  });

  it('does not count digits inside bracket atoms ([13CH3], [NH3+]) as ring bonds', () => {
    passes('[13CH3][NH3+]'.repeat(400));
  });

  it('refuses more ring bonds than the limit', () => {
    const smiles = Array.from({ length: 2 * (SCREEN_LIMITS.ringBonds + 1) }, (_, i) => `C%${10 + (i % 90)}`).join('');
    expect(() => screenInput({ smiles })).toThrow(/ring bonds/);
  });

  it('refuses more atoms than the limit, counting Cl and Br once', () => {
    passes('Cl'.repeat(SCREEN_LIMITS.atoms));
    expect(() => screenInput({ smiles: 'C'.repeat(SCREEN_LIMITS.atoms + 1) })).toThrow(/atoms/);
  });
});
