import type { Config } from 'tailwindcss';

/**
 * Edgeledger's palette: warm paper and slate ink with one accent (a quenched-steel teal).
 * Colours are named by their role, so a component says what it means, not which hue it is.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: '#f7f5f0',
        panel: '#ffffff',
        ink: '#1f2328',
        muted: '#5b6270',
        rule: '#d9d4c7',
        accent: { DEFAULT: '#0f6e6a', strong: '#0a4f4c', soft: '#d7ecea' },
        caution: { DEFAULT: '#8a4b08', soft: '#fbefd9' },
        danger: { DEFAULT: '#a12a2a', soft: '#f8e1e1' },
      },
      fontFamily: {
        serif: ['Literata', 'Georgia', 'serif'],
        sans: ['system-ui', '-apple-system', 'Segoe UI', 'Roboto', 'sans-serif'],
      },
    },
  },
} satisfies Config;
