import type { Config } from 'tailwindcss';
import { palette } from './src/components/ui/palette';

/**
 * Our own look: warm paper, deep slate ink, one amber accent for "look here" (the tokens and
 * their contrast rules are in src/components/ui/palette.ts). Motor colours come from the
 * Okabe–Ito colour-blind-safe palette and are used for motors only.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
