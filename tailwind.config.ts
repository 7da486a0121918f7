// Splitcase theme: named tokens only; components never use raw hex.
// Tailwind 4 reads this through the `@config` line in apps/web/src/styles.css.
import type { Config } from 'tailwindcss';

export default {
  content: ['./apps/web/index.html', './apps/web/src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        // graphite neutrals, near-black to warm paper
        graphite: {
          950: '#16191d',
          900: '#1f2328',
          800: '#2b3036',
          700: '#3d434a',
          600: '#555c64',
          500: '#646b72',
          400: '#8c9298',
          300: '#b3b7bb',
          200: '#d9d8d3',
          150: '#e4e2dc',
          100: '#eceae4',
          50: '#f6f4f0',
        },
        paper: '#f6f4f0',
        // copper accent: primary actions, focus ring, links, callout pins
        copper: {
          800: '#7a4220',
          700: '#8f4e26',
          600: '#a35a2c',
          500: '#c2703d',
          400: '#d48b5c',
          200: '#ecc9b0',
          100: '#f5e3d6',
          50: '#fbf3ed',
        },
        // cell teal: energy and power figures, "published"
        cell: {
          800: '#124843',
          700: '#175c56',
          600: '#1f7a72',
          400: '#4fa89f',
          100: '#d4ebe8',
          50: '#ebf6f4',
        },
        // amber: "in review", cautions
        amber: {
          800: '#7d5214',
          700: '#96621a',
          600: '#b7791f',
          100: '#f6e7c8',
          50: '#fbf4e4',
        },
        // brick: critical
        brick: {
          800: '#7f291f',
          700: '#962f23',
          600: '#b23a2b',
          100: '#f5d9d4',
          50: '#fbefec',
        },
        // chart series: Okabe–Ito colour-blind-safe set (Okabe & Ito, 2008)
        series: {
          orange: '#E69F00',
          sky: '#56B4E9',
          green: '#009E73',
          yellow: '#F0E442',
          blue: '#0072B2',
          vermilion: '#D55E00',
          purple: '#CC79A7',
          black: '#000000',
        },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        '2xs': ['0.6875rem', { lineHeight: '1rem' }],
      },
      boxShadow: {
        card: '0 1px 0 rgba(22,25,29,0.04), 0 1px 3px rgba(22,25,29,0.06)',
        pop: '0 8px 24px rgba(22,25,29,0.16)',
      },
    },
  },
} satisfies Config;
