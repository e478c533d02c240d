// The theme colours that code draws with (editor and molecule pictures, exports, presence): the same
// values as the `--color-*` variables of the `@theme` block in src/index.css, where Tailwind 4 keeps
// the theme. The server's SVG/PNG exports cannot read CSS, so the values are written here too;
// tests/unit/theme-colours.test.ts fails when the two disagree.
//
// paper — warm off-white surfaces; ink — deep teal for text and accents.
// bead — a colour-blind-safe categorical palette for beads (the eight colours proposed by Okabe & Ito,
// "Color Universal Design", 2008; hex values from memory of that proposal). Order matters: bead n
// takes the n-th colour (palette.ts).
export const THEME_COLOURS = {
  paper: {
    50: '#fdfbf6',
    100: '#f8f4ea',
    200: '#efe8d8',
    300: '#e2d7bf',
    400: '#cdbd9b',
  },
  ink: {
    50: '#edf5f4',
    100: '#d3e7e5',
    200: '#a8cfcb',
    300: '#73b0aa',
    400: '#438f89',
    500: '#27726d',
    600: '#1c5d5a',
    700: '#174c4a',
    800: '#133e3d',
    900: '#0e3030',
    950: '#081f1f',
  },
  bead: {
    orange: '#e69f00',
    sky: '#56b4e9',
    green: '#009e73',
    yellow: '#f0e442',
    blue: '#0072b2',
    vermillion: '#d55e00',
    purple: '#cc79a7',
    black: '#000000',
  },
} as const;
