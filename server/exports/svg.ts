import theme from '../../tailwind.config';
import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';

// The mapping picture as standalone SVG, drawn from the molecule's 2D layout (the same coordinates the
// editor draws): each bead a soft translucent hull (discs on its atoms, thick strokes along its bonds)
// in the colour-blind-safe bead palette, the skeleton over it, hetero-atom labels, bead names at their
// atoms' centroid. Optional highlighted atoms get a ring (the compare screen's "moved atoms").
// <title>, <desc> and <metadata> carry the mapping, version and SHA-256.

const { bead, ink, paper } = theme.theme.extend.colors;
const PALETTE = [bead.orange, bead.sky, bead.green, bead.yellow, bead.blue, bead.vermillion, bead.purple, bead.black];
const INK = ink[800];
const PAPER = paper[50];
const UNIT = 36;
const MARGIN = 28;

const esc = (v: string) => v.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const f = (v: number) => (Math.round(v * 10) / 10).toString();

export interface SvgOptions {
  /** 0-based atom indices to ring. */
  highlight?: readonly number[];
}

export function toSvg(s: ExportSource, opts: SvgOptions = {}): string {
  const atoms = s.model.atoms;
  const xs = atoms.map((a) => a.x);
  const ys = atoms.map((a) => a.y);
  const minX = Math.min(...xs, 0);
  const minY = Math.min(...ys, 0);
  const width = Math.max(160, (Math.max(...xs, 0) - minX) * UNIT + 2 * MARGIN);
  const height = Math.max(120, (Math.max(...ys, 0) - minY) * UNIT + 2 * MARGIN);
  const px = (i: number) => (atoms[i].x - minX) * UNIT + MARGIN;
  const py = (i: number) => (atoms[i].y - minY) * UNIT + MARGIN;

  const out: string[] = [];
  const title = `${s.mappingName} · ${stateLabel(s)}${s.production ? ' (production)' : ''}`;
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${f(width)}" height="${f(height)}" viewBox="0 0 ${f(width)} ${f(height)}" role="img" aria-labelledby="t">`);
  out.push(`<title id="t">${esc(title)}</title>`);
  out.push(`<desc>Beadloom mapping picture of ${esc(s.moleculeName)}; sha256 ${s.sha256}</desc>`);
  out.push(`<metadata>${esc(JSON.stringify({ mapping: s.mappingName, version: s.version, production: s.production, sha256: s.sha256 }))}</metadata>`);
  out.push(`<rect width="100%" height="100%" fill="${PAPER}"/>`);

  s.draft.beads.forEach((b, n) => {
    const colour = PALETTE[n % PALETTE.length];
    const inBead = new Set(b.atoms.map((a) => a.index));
    out.push(`<g fill="${colour}" stroke="${colour}" opacity="0.35" data-bead="${esc(b.id)}">`);
    for (const bond of s.model.bonds) if (inBead.has(bond.a) && inBead.has(bond.b)) out.push(`<line x1="${f(px(bond.a))}" y1="${f(py(bond.a))}" x2="${f(px(bond.b))}" y2="${f(py(bond.b))}" stroke-width="${UNIT * 0.7}" stroke-linecap="round"/>`);
    for (const i of inBead) out.push(`<circle cx="${f(px(i))}" cy="${f(py(i))}" r="${UNIT * 0.38}" stroke="none"/>`);
    out.push('</g>');
  });

  out.push(`<g stroke="${INK}" stroke-width="2" stroke-linecap="round">`);
  for (const bond of s.model.bonds) {
    const [x1, y1, x2, y2] = [px(bond.a), py(bond.a), px(bond.b), py(bond.b)];
    const order = bond.aromatic ? 2 : Math.max(1, bond.order);
    const len = Math.hypot(x2 - x1, y2 - y1) || 1;
    const [nx, ny] = [(-(y2 - y1) / len) * 3.5, ((x2 - x1) / len) * 3.5];
    const offsets = order === 1 ? [0] : order === 2 ? [-1, 1] : [-2, 0, 2];
    for (const k of offsets) out.push(`<line x1="${f(x1 + nx * k * 0.6)}" y1="${f(y1 + ny * k * 0.6)}" x2="${f(x2 + nx * k * 0.6)}" y2="${f(y2 + ny * k * 0.6)}"${bond.aromatic && k > 0 ? ' stroke-dasharray="4 3"' : ''}/>`);
  }
  out.push('</g>');

  out.push(`<g font-family="Open Sans, DejaVu Sans, sans-serif" font-size="14" text-anchor="middle" dominant-baseline="central">`);
  atoms.forEach((a, i) => {
    if (a.element === 'C' && a.charge === 0) return;
    const label = `${a.element}${a.charge ? (a.charge > 0 ? '+' : '−') : ''}`;
    out.push(`<circle cx="${f(px(i))}" cy="${f(py(i))}" r="9" fill="${PAPER}"/><text x="${f(px(i))}" y="${f(py(i))}" fill="${INK}">${esc(label)}</text>`);
  });
  out.push('</g>');

  for (const i of opts.highlight ?? []) {
    if (atoms[i]) out.push(`<circle cx="${f(px(i))}" cy="${f(py(i))}" r="${UNIT * 0.42}" fill="none" stroke="${bead.vermillion}" stroke-width="3" stroke-dasharray="5 3" data-moved-atom="${i + 1}"/>`);
  }

  out.push(`<g font-family="Open Sans, DejaVu Sans, sans-serif" font-size="13" font-weight="700" text-anchor="middle" fill="${INK}">`);
  for (const b of s.draft.beads) {
    if (!b.atoms.length) continue;
    const cx = b.atoms.reduce((t, a) => t + px(a.index), 0) / b.atoms.length;
    const cy = b.atoms.reduce((t, a) => t + py(a.index), 0) / b.atoms.length;
    out.push(`<text x="${f(cx)}" y="${f(cy - UNIT * 0.55)}" stroke="${PAPER}" stroke-width="3" paint-order="stroke">${esc(b.name)}</text>`);
  }
  out.push('</g>');
  out.push('</svg>');
  return out.join('\n') + '\n';
}
