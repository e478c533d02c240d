import type { Config } from 'tailwindcss';

// Beadloom's theme. Loaded from src/index.css with `@config`, so this file is
// the one place colours and type are decided.
//
// paper — warm off-white surfaces; ink — deep teal for text and accents.
// bead — a colour-blind-safe categorical palette for beads (the eight colours
// proposed by Okabe & Ito, "Color Universal Design", 2008; hex values from
// memory of that proposal). Order matters: bead n takes bead-(n mod 8).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
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
        // Messages: errors and success, dark enough for text on paper.
        alert: { 50: '#fbeee8', 600: '#b0400e', 700: '#8f330b' },
        ok: { 50: '#e8f4ee', 600: '#137a57', 700: '#0f6347' },
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
      },
      fontFamily: {
        sans: ['"Open Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'Consolas', 'monospace'],
      },
      boxShadow: {
        card: '0 1px 2px rgb(14 48 48 / 0.06), 0 2px 8px rgb(14 48 48 / 0.05)',
      },
    },
  },
} satisfies Config;
