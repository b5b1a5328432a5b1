import type { Config } from 'tailwindcss';

/**
 * The colours, by name. Components use the Tailwind names (`bg-leaf`); SVG drawings that set `fill` and `stroke`
 * read the same values through `src/lib/palette.ts`. Nothing else in src/ writes a colour value.
 */
export const palette = {
  soil: { DEFAULT: '#3d2e26' },
  paper: { DEFAULT: '#faf7f0', 100: '#f3eee2', 200: '#e6dece', 300: '#d3c8b3' },
  leaf: { DEFAULT: '#2f6b3b', 50: '#edf4e8', 100: '#dcebd3', 700: '#24552e', 800: '#1c4324' },
  shoot: { DEFAULT: '#8fbf6a', 100: '#e4f0d9' },
  straw: { DEFAULT: '#e8d59b', 100: '#f5ecce' },
  water: { DEFAULT: '#2e6b8c', 50: '#e7f0f5', 700: '#23546e' },
  clay: { DEFAULT: '#b4533a', 50: '#faece7', 700: '#8e3f2b' },
  stone: { DEFAULT: '#6f695f' },
  white: '#ffffff',
  // The plot book's drawing: the bed's ground and the soft fills that tell its parts apart (each part is also labelled).
  bed: { ground: '#f1e4d3', 1: '#dcebd0', 2: '#f3e8c4', 3: '#cfe3d6', 4: '#efe2b8' },
} as const;

/**
 * The Tillwell palette lives here and nowhere else; components use the names.
 * Every text/background pair used in the app was checked for WCAG AA (4.5:1).
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ['"Work Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
