import type { Config } from 'tailwindcss';

// High contrast for a bright shop floor: dark ink on white, one strong working colour,
// safety amber reserved for cautions. Every pair used for text passes WCAG AA (most AAA).
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './features/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#101317', soft: '#3b424b', faint: '#6b7480' },
        paper: { DEFAULT: '#ffffff', dim: '#f2f4f6', line: '#c9ced4' },
        work: { DEFAULT: '#0a4f8a', dark: '#073a66', tint: '#e3eefa' },
        caution: { DEFAULT: '#ffb300', ink: '#3d2a00', tint: '#fff4d6' },
        danger: { DEFAULT: '#b3261e', tint: '#fde8e6' },
        ok: { DEFAULT: '#1d6b36', tint: '#e3f4e8' },
      },
      fontFamily: {
        sans: ['var(--font-inter)', 'system-ui', 'sans-serif'],
      },
      minHeight: { touch: '3rem' },
      minWidth: { touch: '3rem' },
    },
  },
};

export default config;
