import type { Config } from 'tailwindcss';

/**
 * Our own look: warm paper, deep slate ink, one amber accent for "look here". Motor colours
 * come from the Okabe–Ito colour-blind-safe palette and are used for motors only.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f5f0', raised: '#ffffff', sunk: '#eeebe3' },
        ink: { DEFAULT: '#1c2733', soft: '#4a5866', faint: '#7d8894' },
        slate: { brand: '#1f3a4d' },
        line: '#dcd7cc',
        accent: { DEFAULT: '#c7771a', soft: '#f6e3c8' },
        sev: { note: '#3f6e8c', watch: '#b7791f', act: '#b4443c' },
        ok: '#2f7d5b',
      },
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
