import type { Config } from 'tailwindcss';

// Design tokens: paper and asphalt, one teal accent, our own condition palette.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: '#f7f5f0',
        asphalt: { DEFAULT: '#1f2328', soft: '#2d3239', line: '#d9d4c7', muted: '#5b6068' },
        accent: { DEFAULT: '#0f766e', dark: '#0b5a54', light: '#d8ece9' },
        band: {
          verygood: '#0f766e',
          good: '#4d9a7a',
          fair: '#d6b25e',
          poor: '#b45309',
          failed: '#7f1d1d',
          none: '#4b5058',
        },
        caution: { DEFAULT: '#8a5a00', bg: '#fbf1dc' },
      },
      fontFamily: {
        sans: ['Lato', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
