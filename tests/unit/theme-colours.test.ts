import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { THEME_COLOURS } from '../../src/shared/drawing/theme-colours';

// The theme lives in src/index.css (`@theme`, Tailwind 4); code that draws (and the server's exports)
// reads the same colours from src/shared/drawing/theme-colours.ts. A colour changed in one place only
// would make the editor and the exported pictures disagree.

const css = readFileSync(new URL('../../src/index.css', import.meta.url), 'utf8');
const themeBlock = css.match(/@theme\s*\{([^}]*)\}/)?.[1] ?? '';
const variables = new Map([...themeBlock.matchAll(/--([\w-]+)\s*:\s*([^;]+);/g)].map((m) => [m[1], m[2].trim()]));

describe('theme colours', () => {
  it('the CSS has one @theme block with the colours', () => {
    expect(themeBlock).not.toBe('');
    expect(variables.get('color-ink-900')).toBe('#0e3030');
  });

  it('every colour code draws with is the same in src/index.css', () => {
    const inCode = Object.entries(THEME_COLOURS).flatMap(([group, shades]) =>
      Object.entries(shades).map(([shade, value]) => [`color-${group}-${shade}`, value] as const),
    );
    expect(inCode.length).toBe(5 + 11 + 8);
    for (const [name, value] of inCode) expect({ name, value: variables.get(name) }).toEqual({ name, value });
  });

  it('every paper, ink and bead colour of the CSS is known to the code', () => {
    const inCss = [...variables.keys()].filter((k) => /^color-(paper|ink|bead)-/.test(k));
    const inCode = new Set(Object.entries(THEME_COLOURS).flatMap(([group, shades]) => Object.keys(shades).map((s) => `color-${group}-${s}`)));
    expect(inCss.filter((k) => !inCode.has(k))).toEqual([]);
  });
});
