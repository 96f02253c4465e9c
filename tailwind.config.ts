import type { Config } from 'tailwindcss';

// Loadline's theme tokens (loaded from src/styles.css with @config).
// One restrained accent; neutrals carry the page. The categorical chart palette is Okabe-Ito
// (colour-blind safe) and lives in src/charts/theme.ts so every chart uses it the same way.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        canvas: '#f7f8f7',
        surface: '#ffffff',
        ink: { DEFAULT: '#1d2a2f', soft: '#4a5a60', faint: '#7b8a8f' },
        line: '#dde3e1',
        accent: { DEFAULT: '#1f6f78', strong: '#17545b', tint: '#e3f0f1' },
        good: '#2f7d4f',
        caution: '#9a6a00',
        bad: '#a4343a',
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
