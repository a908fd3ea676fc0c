import type { Config } from 'tailwindcss';

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Inter Tight Variable"', 'system-ui', 'sans-serif'] },
      colors: {
        // Our own palette: slate ink, a teal for action, amber for holds, brick for refusals.
        // Read on a shift tablet in bright plant light: every text colour keeps at least 5:1 on
        // every paper and light tint it sits on (WCAG AA asks 4.5:1); ink-soft keeps 7:1.
        //   on paper-raised / paper / paper-sunk: ink 15.1 / 13.9 / 12.5, soft 9.1 / 8.3 / 7.5,
        //   faint 6.2 / 5.7 / 5.1, tide 6.9 / 6.3 / 5.7, hold 7.1 / 6.5 / 5.8, refuse 7.4 / 6.8 / 6.1.
        ink: { DEFAULT: '#1d2731', soft: '#3d4a57', faint: '#566270' },
        paper: { DEFAULT: '#f6f5f1', raised: '#ffffff', sunk: '#ebe9e2' },
        tide: { DEFAULT: '#0b655e', dark: '#0a4d47', light: '#ccfbf1' },
        hold: { DEFAULT: '#92400e', light: '#fef3c7' },
        refuse: { DEFAULT: '#a61f15', light: '#fee4e2' },
      },
    },
  },
} satisfies Config;
