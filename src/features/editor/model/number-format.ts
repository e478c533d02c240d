// Number formats for computed values: fixed decimals, a true minus sign, an en dash for "none".

const MINUS = '−';

export function formatFixed(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const s = Math.abs(value).toFixed(digits);
  return value < 0 && Number(s) !== 0 ? MINUS + s : s;
}

/** With an explicit sign for non-zero values: +1.20, −0.35. */
export function formatSigned(value: number | null | undefined, digits: number): string {
  const s = formatFixed(value, digits);
  return value !== null && value !== undefined && value > 0 && Number(s) !== 0 ? `+${s}` : s;
}

export const formatMass = (value: number | null | undefined) => formatFixed(value, 2);
