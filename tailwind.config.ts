import type { Config } from 'tailwindcss';

/**
 * Mendstep's own palette: deep teal ink on warm paper for office screens, a calm dark slate for
 * table mode. Phase accents are always paired with a word and an icon, never colour alone.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['Lexend', 'system-ui', 'sans-serif'],
      },
      colors: {
        ink: { DEFAULT: '#12332f', soft: '#2f5550', muted: '#58716d' },
        paper: { DEFAULT: '#f7f5ef', raised: '#ffffff', sunk: '#ece8dc' },
        moss: { 50: '#eef6f1', 100: '#d5eadf', 500: '#2f7d5b', 600: '#236648', 700: '#1a4f38' },
        ember: { 50: '#fdf1ec', 500: '#c4521f', 600: '#a54416', 700: '#7f3411' },
        tide: { 50: '#eaf3fb', 500: '#2a6fb0', 600: '#1f5a92', 700: '#174673' },
        slate: { 950: '#0c1417', 900: '#121d21', 800: '#1b2a30', 700: '#27393f' },
        phase: {
          acute: '#3b82c4',
          proliferative: '#c98a12',
          remodelling: '#4f9a6a',
        },
      },
      minHeight: { target: '44px', 'table-target': '64px' },
      minWidth: { target: '44px', 'table-target': '64px' },
    },
  },
} satisfies Config;
