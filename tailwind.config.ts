import type { Config } from 'tailwindcss'

// Hosewright's own look: dark ink on warm paper, one copper accent for actions, severity colours
// that stay distinguishable in print and for common colour-vision deficiencies (also shown by icon/text).
export default {
  content: ['./app/**/*.{vue,ts}', './shared/**/*.ts'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Atkinson Hyperlegible"', 'system-ui', 'sans-serif'],
      },
      fontSize: { base: ['1.0625rem', '1.6rem'] },
      colors: {
        ink: { DEFAULT: '#14202b', soft: '#34495a', muted: '#5b6d7b', line: '#c9d1d6' },
        paper: { DEFAULT: '#f6f3ee', raised: '#ffffff', sunk: '#ebe6de' },
        copper: { DEFAULT: '#a8470f', dark: '#7d3409', light: '#f3ddcd' },
        coolant: { DEFAULT: '#0d6b73', light: '#d4ecee' },
        fuel: { DEFAULT: '#8a5a00', light: '#f6e7c6' },
        severity: { error: '#b3261e', warning: '#8f5b00', note: '#2f5d8a' },
      },
      minHeight: { touch: '2.75rem' },
      minWidth: { touch: '2.75rem' },
    },
  },
  plugins: [],
} satisfies Config
