import type { Config } from 'tailwindcss';

// Thawline's palette: slate and ice for the cold, one warm accent ("ember") for heat.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  darkMode: 'media',
  theme: {
    extend: {
      colors: {
        ice: {
          50: '#f1f8fb', 100: '#dceef6', 200: '#bfe0ee', 300: '#93cbe2', 400: '#5fb0d1',
          500: '#3b93b8', 600: '#2b769b', 700: '#255f7e', 800: '#244f68', 900: '#223f53', 950: '#132837',
        },
        ember: {
          50: '#fff6ed', 100: '#ffead4', 200: '#ffd0a8', 300: '#ffae70', 400: '#fd8037',
          500: '#f25f12', 600: '#e34608', 700: '#bc3209', 800: '#952910', 900: '#782410',
        },
        frost: { DEFAULT: '#7dd3fc' },
      },
      fontFamily: {
        sans: ['var(--font-inter)', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
    },
  },
};

export default config;
