import type { Config } from 'tailwindcss';

// Quadrille's own palette: warm paper, graphite text, marker greys for tone,
// one ink for actions and one stamp colour reserved for "ready to ink" (`ready`).
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './hooks/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f2e8', deep: '#efe7d6', edge: '#ded3bd' },
        graphite: { DEFAULT: '#2a2a2d', soft: '#4a4a50', faint: '#77767d' },
        marker: {
          10: '#ecebe8',
          20: '#d9d7d2',
          40: '#b4b1aa',
          60: '#8c8983',
          80: '#5f5d59',
        },
        ink: { DEFAULT: '#1d4e6e', hover: '#163c55', light: '#dbe8f0' },
        // Red for errors, warnings and deleting. (Named before "ready to ink" had a colour of its own: read it as "alert".)
        stamp: { DEFAULT: '#b8321f', light: '#f6dcd6' },
        // The stamp colour: the "ready to ink" mark and its button, nothing else, so an approval never looks like an
        // error. #24603a on its light tint is about 6.3:1, on white 7.5:1 (WCAG 2.x contrast formula; AA asks 4.5:1).
        ready: { DEFAULT: '#24603a', light: '#e1f0e3' },
      },
      fontFamily: {
        sans: ['var(--font-ui)', 'system-ui', 'sans-serif'],
        display: ['var(--font-display)', 'Georgia', 'serif'],
      },
      boxShadow: {
        card: '0 1px 0 rgba(42,42,45,0.08), 0 2px 6px rgba(42,42,45,0.06)',
      },
    },
  },
  plugins: [],
};

export default config;
