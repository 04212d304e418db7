import type { Config } from 'tailwindcss';

// Whorlbook's own look (product brief): oat, ink, moss, clay and wool; Quicksand everywhere; large radii.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  darkMode: 'class',
  theme: {
    extend: {
      colors: {
        oat: '#F7F1E6',
        ink: '#2A2622',
        moss: { DEFAULT: '#3F6B4E', dark: '#2F5240', light: '#5E8A6C' },
        clay: { DEFAULT: '#B85C38', dark: '#96482A' },
        wool: '#E4D9C6',
      },
      fontFamily: {
        sans: ['Quicksand', 'ui-rounded', 'system-ui', 'sans-serif'],
      },
      borderRadius: {
        soft: '1.25rem',
        blob: '2rem',
      },
      minHeight: { tap: '48px' },
      minWidth: { tap: '48px' },
    },
  },
} satisfies Config;
