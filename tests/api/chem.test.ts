import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';

// The stateless chemistry endpoints: the shared error shape for bad structures
// and mappings, and numbers that agree with hand calculation.

let t: TestApp;
let c: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  c = await signedIn(t.app, 'student@example.org');
});
afterAll(() => t.stop());

describe('POST /api/chem/molecule', () => {
  it('parses benzene: formula and weight (CRC Handbook: benzene 78.11 g/mol)', async () => {
    const res = await c.post('/api/chem/molecule', { smiles: 'c1ccccc1' }).expect(200);
    expect(res.body.formula).toBe('C6H6');
    expect(res.body.molecularWeight).toBeCloseTo(78.11, 2);
    expect(res.body.atoms).toHaveLength(6);
    expect(res.body.atoms[0]).toEqual(expect.objectContaining({ element: 'C', aromatic: true, hydrogens: 1, x: expect.any(Number), y: expect.any(Number) }));
  });

  it('refuses unparseable SMILES with 422 in the shared shape', async () => {
    const res = await c.post('/api/chem/molecule', { smiles: 'C1CC(' }).expect(422);
    expect(res.body.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
  });

  it('refuses empty input with 400', async () => {
    const res = await c.post('/api/chem/molecule', { smiles: '   ' }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
  });

  it('refuses SMILES over 5,000 characters with 413 stating the limit', async () => {
    const res = await c.post('/api/chem/molecule', { smiles: 'C'.repeat(5001) }).expect(413);
    expect(res.body.error.message).toContain('5000');
  });

  it('refuses a body with both or neither of smiles and molfile', async () => {
    await c.post('/api/chem/molecule', { smiles: 'C', molfile: 'x' }).expect(400);
    await c.post('/api/chem/molecule', {}).expect(400);
  });
});

describe('POST /api/chem/evaluate', () => {
  const ethanolOneBead = { beads: [{ id: 'b1', name: 'ETH', centre: 'mass', atoms: [0, 1, 2].map((index) => ({ index, weight: 1 })) }] };

  it('gives the whole molecule mass to a bead holding every atom (ethanol 46.07 g/mol, CRC Handbook)', async () => {
    const res = await c.post('/api/chem/evaluate', { smiles: 'CCO', mapping: ethanolOneBead }).expect(200);
    expect(res.body.evaluation.beads[0].mass).toBeCloseTo(46.07, 2);
    expect(res.body.evaluation.beads[0].heavyAtoms).toBe(3);
  });

  it('refuses atom indices out of range with 422 and names the index', async () => {
    const mapping = { beads: [{ id: 'b1', name: 'X', centre: 'mass', atoms: [{ index: 7, weight: 1 }] }] };
    const res = await c.post('/api/chem/evaluate', { smiles: 'CCO', mapping }).expect(422);
    expect(JSON.stringify(res.body.error)).toContain('7');
  });

  it('refuses negative weights, non-integer indices and duplicate bead ids with 400', async () => {
    const bead = (atoms: unknown, id = 'b1') => ({ id, name: 'X', centre: 'mass', atoms });
    await c.post('/api/chem/evaluate', { smiles: 'CCO', mapping: { beads: [bead([{ index: 0, weight: -0.5 }])] } }).expect(400);
    await c.post('/api/chem/evaluate', { smiles: 'CCO', mapping: { beads: [bead([{ index: 0.5, weight: 1 }])] } }).expect(400);
    await c.post('/api/chem/evaluate', { smiles: 'CCO', mapping: { beads: [bead([{ index: 0, weight: 1 }]), bead([{ index: 1, weight: 1 }])] } }).expect(400);
  });

  it('needs a signed-in caller', async () => {
    const request = (await import('supertest')).default;
    const res = await request(t.app).post('/api/chem/evaluate').send({ smiles: 'C', mapping: { beads: [] } });
    expect([401, 403]).toContain(res.status);
  });
});
