/**
 * The GROMACS index writer, checked against GROMACS itself (Debian's gmx 2022.5, GMX_PATH from
 * `npm test`): a group `gmx make_ndx` writes for atoms 1–20 must come out byte for byte the same from
 * ours, and `gmx check -n` must read our file back with each group's count, first and last atom.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { beadIndexGroups, moleculeAtomNumbers, ndxGroupName, writeNdx } from '../../../server/exports/ndx';

const gmx = process.env.GMX_PATH ?? '/usr/bin/gmx';
const dir = mkdtempSync(join(tmpdir(), 'beadloom-ndx-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const run = (args: string[], input = '') => execFileSync(gmx, ['-quiet', ...args], { cwd: dir, input, encoding: 'utf8', stdio: ['pipe', 'pipe', 'pipe'] });

function gro(n: number): string {
  const lines = ['twenty pseudo-atoms', String(n).padStart(5)];
  for (let i = 1; i <= n; i++) lines.push(`${'1'.padStart(5)}${'RES'.padEnd(5)}${'C1'.padStart(5)}${String(i).padStart(5)}${(i * 0.1).toFixed(3).padStart(8)}${'0.000'.padStart(8)}${'0.000'.padStart(8)}`);
  lines.push('   3.00000   3.00000   3.00000');
  return lines.join('\n') + '\n';
}

describe('GROMACS index (.ndx) writer', () => {
  it('writes a group exactly as gmx make_ndx does: [ name ], four-wide numbers, 15 a line', () => {
    writeFileSync(join(dir, 'twenty.gro'), gro(20));
    run(['make_ndx', '-f', 'twenty.gro', '-o', 'gmx.ndx'], 'a 1-20\nq\n');
    const theirs = readFileSync(join(dir, 'gmx.ndx'), 'utf8');
    const group = theirs.slice(theirs.indexOf('[ a_1-20 ]'));
    const ours = writeNdx([{ name: 'a_1-20', atoms: Array.from({ length: 20 }, (_, i) => i + 1) }]);
    expect(ours).toBe(group);
    expect(ours.split('\n')[1].trim().split(/\s+/)).toHaveLength(15);
  });

  it('is read back by gmx check -n with each group’s count, first and last atom; comments are skipped', () => {
    const text = writeNdx(
      [
        { name: 'head group', atoms: [1, 2, 3, 17, 18] },
        { name: 'tail', atoms: Array.from({ length: 31 }, (_, i) => i + 4) },
      ],
      ['Beadloom test', 'second comment'],
    );
    expect(text.startsWith('; Beadloom test\n; second comment\n[ head_group ]\n')).toBe(true);
    writeFileSync(join(dir, 'ours.ndx'), text);
    const out = run(['check', '-n', 'ours.ndx']);
    const rows = out.split('\n').filter((l) => /^\s+\d+\s+\S+\s+\d+\s+\d+\s+\d+\s*$/.test(l)).map((l) => l.trim().split(/\s+/));
    expect(rows).toEqual([
      ['0', 'head_group', '5', '1', '18'],
      ['1', 'tail', '31', '4', '34'],
    ]);
    // And make_ndx reads it as input (it lists the groups it found before its own defaults).
    writeFileSync(join(dir, 'twenty.gro'), gro(40));
    const listed = run(['make_ndx', '-f', 'twenty.gro', '-n', 'ours.ndx', '-o', 'again.ndx'], 'q\n');
    expect(listed).toMatch(/0 head_group\s+:\s+5 atoms/);
    expect(listed).toMatch(/1 tail\s+:\s+31 atoms/);
  });

  it('numbers atoms after the atom-index contract: listed atoms 1…N, then hydrogens by parent', () => {
    // Ethanol heavy atoms C0 (3 H), C1 (2 H), O2 (1 H): N = 3, hydrogens 4–6 on C0, 7–8 on C1, 9 on O2.
    const atoms = [{ hydrogens: 3 }, { hydrogens: 2 }, { hydrogens: 1 }] as never;
    expect(moleculeAtomNumbers({ atoms })).toEqual([[1, 4, 5, 6], [2, 7, 8], [3, 9]]);
    const groups = beadIndexGroups({ atoms }, [{ name: 'C1 bead', atoms: [{ index: 0 }, { index: 1 }] }, { name: 'OH', atoms: [{ index: 1 }, { index: 2 }] }]);
    expect(groups).toEqual([{ name: 'C1 bead', atoms: [1, 2, 4, 5, 6, 7, 8] }, { name: 'OH', atoms: [2, 3, 7, 8, 9] }]);
    // A second copy of the molecule (9 atoms each) in a system numbering.
    expect(beadIndexGroups({ atoms }, [{ name: 'OH', atoms: [{ index: 2 }] }], 9)[0].atoms).toEqual([12, 18]);
  });

  it('refuses atom numbers that are not positive whole numbers, and makes names single words', () => {
    expect(() => writeNdx([{ name: 'x', atoms: [0] }])).toThrow(/not a positive whole number/);
    expect(() => writeNdx([{ name: 'x', atoms: [1.5] }])).toThrow(RangeError);
    expect(ndxGroupName('  ring [A] 2 ')).toBe('ring_A_2');
    expect(ndxGroupName('   ')).toBe('bead');
  });
});
