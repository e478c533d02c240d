import type { Molecule } from '../chem';
import { attachmentMarkPath } from './attachment-mark';
import { hullPath, type Point } from './hull';
import { BOND, layoutMolecule, type Drawing } from './layout';
import { placeBeadTags, TAG_HEIGHT } from './bead-labels';
import { textOn } from './contrast';
import { DRAWING_COLOURS } from './palette';

/**
 * The one molecule renderer: SVG markup from the shared layout (layout.ts). The editor's structure
 * layer, the molecule page, the list thumbnails and the server's SVG/PNG exports all draw with
 * these functions, so aromatic rings, charges, attachment points, bead colours and tag placement
 * look the same everywhere. Plain strings (no React, no DOM): the server writes them to files, the
 * client puts them into an <svg>. Every text is escaped; numbers are rounded to 0.1 drawing units.
 */

export const FONT_FAMILY = "'Open Sans', sans-serif";
export const HULL_MARGIN = BOND * 0.42;

const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';
/** Subscript digits as real subscripts (a tspan): the bundled font has no U+2080… glyphs. */
const labelText = (label: string) =>
  esc(label).replace(/[₀-₉]+/g, (run) => `<tspan baseline-shift="sub" font-size="75%">${[...run].map((c) => SUBSCRIPT_DIGITS.indexOf(c)).join('')}</tspan>`);

const esc = (v: string) => v.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const f = (v: number) => String(Math.round(v * 10) / 10);

export interface PictureBead {
  id: string;
  name: string;
  atoms: readonly { index: number }[];
  colour: string;
}

/** Bonds, aromatic circles, hydrogens, atom symbols, charges and attachment marks (attachment-mark.ts). */
export function structureMarkup(drawing: Drawing): string {
  const { ink, inkSoft, paper, attachment } = DRAWING_COLOURS;
  const out: string[] = [];
  out.push(`<g stroke="${ink}" stroke-width="2" stroke-linecap="round">`);
  for (const l of drawing.lines) out.push(`<line x1="${f(l.x1)}" y1="${f(l.y1)}" x2="${f(l.x2)}" y2="${f(l.y2)}"/>`);
  for (const h of drawing.hydrogens) out.push(`<line x1="${f(h.from.x)}" y1="${f(h.from.y)}" x2="${f(h.x - (h.x - h.from.x) * 0.3)}" y2="${f(h.y - (h.y - h.from.y) * 0.3)}" stroke="${inkSoft}" stroke-width="1.4"/>`);
  out.push('</g>');
  if (drawing.aromaticRings.length) {
    out.push(`<g fill="none" stroke="${ink}" stroke-width="1.6">`);
    for (const r of drawing.aromaticRings) out.push(`<circle cx="${f(r.x)}" cy="${f(r.y)}" r="${f(r.r)}"/>`);
    out.push('</g>');
  }
  if (drawing.hydrogens.length) {
    out.push(`<g fill="${inkSoft}" font-family="${FONT_FAMILY}" font-size="${f(BOND * 0.3)}" text-anchor="middle" dominant-baseline="central">`);
    for (const h of drawing.hydrogens) out.push(`<text x="${f(h.x)}" y="${f(h.y)}">H</text>`);
    out.push('</g>');
  }
  out.push(`<g font-family="${FONT_FAMILY}" font-size="${f(BOND * 0.42)}" font-weight="600" text-anchor="middle" dominant-baseline="central" stroke="${paper}" stroke-linejoin="round" paint-order="stroke">`);
  for (const a of drawing.atoms) {
    if (a.attachment) {
      out.push(`<path d="${attachmentMarkPath(a, a.bondDirection)}" fill="none" stroke="${attachment}" stroke-width="2.4" stroke-linecap="round" data-attachment="${a.index + 1}"/>`);
      continue;
    }
    if (a.label) out.push(`<text x="${f(a.x)}" y="${f(a.y)}" fill="${ink}" stroke-width="5">${labelText(a.label)}</text>`);
    if (a.charge) out.push(`<text x="${f(a.x + BOND * 0.34)}" y="${f(a.y - BOND * 0.3)}" font-size="${f(BOND * 0.3)}" fill="${ink}" stroke-width="4" data-charge="${a.index + 1}">${esc(a.charge)}</text>`);
  }
  out.push('</g>');
  return out.join('');
}

/** Beads as soft translucent hulls round their atoms (the editor's look). */
export function hullsMarkup(beads: readonly PictureBead[], points: readonly Point[]): string {
  return beads
    .map((b) => {
      const d = hullPath(b.atoms.map((a) => points[a.index]).filter(Boolean), HULL_MARGIN);
      return d ? `<path d="${d}" fill="${b.colour}" fill-opacity="0.26" stroke="${b.colour}" stroke-opacity="0.9" stroke-width="1.5" stroke-linejoin="round" data-bead="${esc(b.id)}"/>` : '';
    })
    .join('');
}

/** Bead name tags in the bead's colour, placed off atom symbols (bead-labels.ts). */
export function beadTagsMarkup(beads: readonly PictureBead[], drawing: Drawing): string {
  const tags = placeBeadTags(beads, drawing.atoms, (i) => !!drawing.atoms[i].label, HULL_MARGIN);
  const out: string[] = [`<g font-family="${FONT_FAMILY}" font-size="${f(BOND * 0.3)}" font-weight="700" text-anchor="middle" dominant-baseline="central">`];
  beads.forEach((b, i) => {
    const t = tags[i];
    if (!t) return;
    out.push(
      `<g transform="translate(${f(t.x)},${f(t.y)})" data-bead-tag="${esc(b.name)}"><rect x="${f(-t.width / 2)}" y="${f(-TAG_HEIGHT / 2)}" width="${f(t.width)}" height="${f(TAG_HEIGHT)}" rx="${f(TAG_HEIGHT / 2)}" fill="${b.colour}"/><text fill="${textOn(b.colour)}">${esc(b.name)}</text></g>`,
    );
  });
  out.push('</g>');
  return out.join('');
}

export interface PictureOptions {
  beads?: readonly PictureBead[];
  /** 0-based atom indices to ring (the compare screen's moved atoms). */
  highlight?: readonly number[];
  showHydrogens?: boolean;
  /** Drawing units of empty border. */
  padding?: number;
  /** Pixel size of the picture; default: one drawing unit per pixel. */
  width?: number;
  height?: number;
  title?: string;
  desc?: string;
  /** JSON placed in <metadata>. */
  metadata?: unknown;
  /** Paint the paper background (files); off for pictures inside the app, which sit on paper already. */
  background?: boolean;
  /** Extra attributes on the root <svg> (role, aria-label, class). */
  attributes?: Record<string, string>;
}

/** A whole standalone SVG picture of a molecule, optionally with its beads. */
export function moleculeSvg(molecule: Pick<Molecule, 'atoms' | 'bonds'>, opts: PictureOptions = {}): string {
  const drawing = layoutMolecule(molecule, opts.showHydrogens ?? false);
  const beads = opts.beads ?? [];
  const pad = opts.padding ?? (beads.length ? BOND * 1.1 : BOND * 0.6);
  const { minX, minY, maxX, maxY } = drawing.bounds;
  const vw = Math.max(maxX - minX + 2 * pad, BOND * 2);
  const vh = Math.max(maxY - minY + 2 * pad, BOND * 1.5);
  const vx = (minX + maxX) / 2 - vw / 2;
  const vy = (minY + maxY) / 2 - vh / 2;
  const attrs = Object.entries(opts.attributes ?? {}).map(([k, v]) => ` ${k}="${esc(v)}"`).join('');
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${f(opts.width ?? vw)}" height="${f(opts.height ?? vh)}" viewBox="${f(vx)} ${f(vy)} ${f(vw)} ${f(vh)}"${opts.title ? ' aria-labelledby="t"' : ''}${attrs}>`,
  ];
  if (opts.title) out.push(`<title id="t">${esc(opts.title)}</title>`);
  if (opts.desc) out.push(`<desc>${esc(opts.desc)}</desc>`);
  if (opts.metadata !== undefined) out.push(`<metadata>${esc(JSON.stringify(opts.metadata))}</metadata>`);
  if (opts.background) out.push(`<rect x="${f(vx)}" y="${f(vy)}" width="${f(vw)}" height="${f(vh)}" fill="${DRAWING_COLOURS.paper}"/>`);
  if (beads.length) out.push(`<g>${hullsMarkup(beads, drawing.atoms)}</g>`);
  out.push(structureMarkup(drawing));
  for (const i of opts.highlight ?? []) {
    const a = drawing.atoms[i];
    if (a) out.push(`<circle cx="${f(a.x)}" cy="${f(a.y)}" r="${f(BOND * 0.42)}" fill="none" stroke="${DRAWING_COLOURS.highlight}" stroke-width="3" stroke-dasharray="5 3" data-moved-atom="${i + 1}"/>`);
  }
  if (beads.length) out.push(beadTagsMarkup(beads, drawing));
  out.push('</svg>');
  return out.join('\n') + '\n';
}
