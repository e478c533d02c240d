/**
 * Where a free counter-ion goes in a conformer: in contact with an atom of opposite charge.
 *
 * A free ion (one atom, charged, bonded to nothing: Na+, Cl-, Ca2+, NH4+) is placed at a contact
 * distance d from a partner atom of opposite formal charge in another part of the structure (for a
 * salt of free ions only, the partner is another free ion). d = r(ion) + 1.40 Å, where r(ion) is the
 * ion's Shannon effective ionic radius (R. D. Shannon, Acta Cryst. 1976, A32, 751; six-coordinate
 * values, from memory of that table) and 1.40 Å is the radius of O2− in the same table, standing for
 * the partner atom. The rule is ours (common practice of this kind, no source): Na+···O− 2.42 Å,
 * Cl−···N+ 3.21 Å, close to contact distances in crystals of such salts. The ion sits on the side of
 * the partner facing away from its neighbours, in the direction (of 26 tried) that keeps it farthest
 * from every other atom; partners are shared out in turn when there are several.
 */
const SHANNON_RADIUS: Record<string, number> = {
  Li: 0.76, Na: 1.02, K: 1.38, Rb: 1.52, Cs: 1.67, Mg: 0.72, Ca: 1.0, Sr: 1.18, Ba: 1.35, Zn: 0.74,
  F: 1.33, Cl: 1.81, Br: 1.96, I: 2.2, N: 1.46, O: 1.4,
};
const PARTNER_RADIUS = 1.4;
const DEFAULT_RADIUS = 1.0;

export function contactDistance(element: string): number {
  return (SHANNON_RADIUS[element] ?? DEFAULT_RADIUS) + PARTNER_RADIUS;
}

const DIRECTIONS: number[][] = [];
for (const x of [-1, 0, 1]) for (const y of [-1, 0, 1]) for (const z of [-1, 0, 1]) {
  if (x || y || z) {
    const n = Math.hypot(x, y, z);
    DIRECTIONS.push([x / n, y / n, z / n]);
  }
}

/**
 * A position for the ion at `distance` from `partner`: the direction away from the partner's bonded
 * neighbours is preferred; among the candidate directions the one farthest from all `others` wins.
 */
export function contactPosition(partner: number[], neighbours: number[][], others: number[][], distance: number): number[] {
  const away = [0, 0, 0];
  for (const q of neighbours) for (let k = 0; k < 3; k++) away[k] += partner[k] - q[k];
  const norm = Math.hypot(...away);
  const candidates = norm > 1e-6 ? [away.map((v) => v / norm), ...DIRECTIONS] : DIRECTIONS;
  let best = candidates[0];
  let bestClearance = -Infinity;
  for (const dir of candidates) {
    const p = partner.map((v, k) => v + distance * dir[k]);
    let clearance = Infinity;
    for (const o of others) clearance = Math.min(clearance, Math.hypot(p[0] - o[0], p[1] - o[1], p[2] - o[2]));
    // The outward direction wins unless another one is clearly freer (by 0.5 Å).
    if (clearance > bestClearance + (bestClearance === -Infinity ? 0 : 0.5)) {
      best = dir;
      bestClearance = clearance;
    }
  }
  return partner.map((v, k) => v + distance * best[k]);
}
