import type { Config } from 'tailwindcss';

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Inter Tight"', 'system-ui', 'sans-serif'] },
      colors: {
        // Our own palette: slate ink, a teal for action, amber for holds, brick for refusals.
        ink: { DEFAULT: '#1d2731', soft: '#4a5866', faint: '#8a96a3' },
        paper: { DEFAULT: '#f6f5f1', raised: '#ffffff', sunk: '#ebe9e2' },
        tide: { DEFAULT: '#0f766e', dark: '#115e59', light: '#ccfbf1' },
        hold: { DEFAULT: '#b45309', light: '#fef3c7' },
        refuse: { DEFAULT: '#b42318', light: '#fee4e2' },
      },
    },
  },
} satisfies Config;
