/** Dark or light text for a tag of the given colour (WCAG relative luminance, threshold 0.18, where black and white text contrast equally). */
export function textOn(hex: string): string {
  const n = parseInt(hex.slice(1), 16);
  const channel = (v: number) => {
    const c = v / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const l = 0.2126 * channel((n >> 16) & 255) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
  return l > 0.18 ? '#0e3030' : '#fdfbf6';
}
