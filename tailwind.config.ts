import type { Config } from 'tailwindcss';

// Driftcase palette: deep slate chrome, a neutral workspace, one teal-free cobalt accent
// for primary actions, and the Okabe–Ito data colours (Okabe & Ito 2008, "Color Universal Design").
export default {
  content: ['./web/index.html', './web/src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['Lato', 'system-ui', 'sans-serif'] },
      fontSize: {
        xs: ['12px', '16px'],
        sm: ['14px', '20px'],
        base: ['16px', '24px'],
        lg: ['20px', '28px'],
        xl: ['24px', '32px'],
      },
      colors: {
        chrome: {
          950: '#0f1722',
          900: '#16212f',
          800: '#1f2d3f',
          700: '#2b3c52',
          600: '#3d5270',
          300: '#a9b8cc',
          100: '#e3e9f1',
        },
        canvas: { DEFAULT: '#f4f5f2', raised: '#ffffff', line: '#d9dcd4', sunk: '#eceee8' },
        accent: { DEFAULT: '#3b4cca', strong: '#2c3aa6', soft: '#e6e8fa' },
        ink: { DEFAULT: '#1b2430', muted: '#5a6472', faint: '#8a93a0' },
        series: {
          replay: '#0072B2',
          onboard: '#E69F00',
          reference: '#009E73',
          flag: '#D55E00',
          event: '#CC79A7',
        },
        state: { ok: '#1f7a4d', warn: '#9a6200', bad: '#b3261e', info: '#2d5b9a' },
      },
    },
  },
} satisfies Config;
