import type { Config } from 'tailwindcss';

// Colours are CSS variables (src/styles.css) so the dark theme swaps them in one place.
const v = (name: string) => `var(--ft-${name})`;

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: v('paper'),
        sheet: v('sheet'),
        rule: v('rule'),
        ink: v('ink'),
        muted: v('muted'),
        agree: v('agree'),
        'agree-soft': v('agree-soft'),
        caution: v('caution'),
        'caution-soft': v('caution-soft'),
        hazard: v('hazard'),
        'hazard-soft': v('hazard-soft'),
      },
      fontFamily: {
        serif: ['"Merriweather"', 'Georgia', 'serif'],
        sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace'],
      },
      maxWidth: { page: '76rem' },
    },
  },
} satisfies Config;
