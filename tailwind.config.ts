import type { Config } from 'tailwindcss';

/**
 * Sixfold's own palette and type scale. "ink" is the night-blue of a late practice room,
 * "brass" the warm metal of a horn, "reed" a cane green for what went right, "ember" for
 * what slipped. Colours are CSS variables so the dark theme swaps them in one place.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  darkMode: 'class',
  theme: {
    extend: {
      fontFamily: {
        sans: ['Manrope', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        caption: ['0.8125rem', { lineHeight: '1.25rem' }],
        body: ['1rem', { lineHeight: '1.6rem' }],
        lead: ['1.1875rem', { lineHeight: '1.8rem' }],
        title: ['1.625rem', { lineHeight: '2.1rem', fontWeight: '700' }],
        display: ['2.375rem', { lineHeight: '2.75rem', fontWeight: '800' }],
      },
      colors: {
        surface: 'rgb(var(--sf-surface) / <alpha-value>)',
        raised: 'rgb(var(--sf-raised) / <alpha-value>)',
        line: 'rgb(var(--sf-line) / <alpha-value>)',
        text: 'rgb(var(--sf-text) / <alpha-value>)',
        muted: 'rgb(var(--sf-muted) / <alpha-value>)',
        ink: {
          50: '#eef2f8',
          100: '#d6dfee',
          300: '#8da3c7',
          500: '#3f5b8c',
          700: '#22365b',
          800: '#182743',
          900: '#0f1a2f',
          950: '#080f1d',
        },
        brass: {
          100: '#fbefd2',
          300: '#f1c970',
          500: '#d99a1e',
          600: '#b67b0c',
          700: '#8c5c07',
        },
        reed: { 100: '#dcf3e4', 500: '#2f9e5e', 700: '#1d6b3e' },
        ember: { 100: '#fbe0da', 500: '#d2492a', 700: '#9a2f17' },
        dusk: { 100: '#e7e1f7', 500: '#6b4fc2', 700: '#4a3490' },
      },
      borderRadius: {
        card: '0.875rem',
      },
    },
  },
} satisfies Config;
