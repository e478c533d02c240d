import type { Point } from './hull';
import { BOND } from './layout';

/**
 * The attachment mark (our own design): where a repeat unit or end group joins the next unit, the
 * bond runs up to the attachment point and ends in a short wavy line across it — the "bond cut here"
 * sign of hand-drawn structures — instead of an element symbol or a `*`. The wave is three half
 * periods long, centred on the point and square to the bond; an attachment point with no bond gets the
 * same wave, level. The path uses quadratic Bézier half-waves, so it scales cleanly in every export.
 */
const HALF_LENGTH = BOND * 0.3;
const AMPLITUDE = BOND * 0.09;
const HALF_WAVES = 3;

const f = (v: number) => String(Math.round(v * 10) / 10);

/** SVG path data of the mark at `at`, for a bond arriving along the unit vector `direction`. */
export function attachmentMarkPath(at: Point, direction: Point | null | undefined): string {
  const along = direction ?? { x: 0, y: -1 };
  const across = { x: -along.y, y: along.x };
  const step = (2 * HALF_LENGTH) / HALF_WAVES;
  const point = (t: number, bulge: number) => ({
    x: at.x + across.x * (t - HALF_LENGTH) + along.x * bulge,
    y: at.y + across.y * (t - HALF_LENGTH) + along.y * bulge,
  });
  const start = point(0, 0);
  const parts = [`M${f(start.x)} ${f(start.y)}`];
  for (let k = 0; k < HALF_WAVES; k++) {
    // Each half-wave bulges to the other side of the line, so the wave crosses the bond end.
    const control = point((k + 0.5) * step, (k % 2 === 0 ? 2 : -2) * AMPLITUDE);
    const end = point((k + 1) * step, 0);
    parts.push(`Q${f(control.x)} ${f(control.y)} ${f(end.x)} ${f(end.y)}`);
  }
  return parts.join('');
}
