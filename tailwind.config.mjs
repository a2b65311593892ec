/** @type {import('tailwindcss').Config} */
// Groundwork's own palette: a deep slate-teal ("ground"), a warm clay accent, and readiness
// colours that always come with a word and an icon (colour is never the only signal).
export default {
  content: ['./src/**/*.{astro,html,js,jsx,ts,tsx,md}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Source Sans 3"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      colors: {
        ground: {
          50: '#f2f7f6',
          100: '#dcebe8',
          200: '#b9d6d0',
          300: '#8dbab2',
          400: '#5f988f',
          500: '#437c74',
          600: '#34635d',
          700: '#2b504c',
          800: '#25413e',
          900: '#1c302e',
          950: '#0f1c1b',
        },
        clay: {
          50: '#fbf5ef',
          100: '#f5e6d6',
          200: '#ebcaa9',
          300: '#dfa775',
          400: '#d4874c',
          500: '#c26d33',
          600: '#a65629',
          700: '#864324',
          800: '#6c3823',
          900: '#592f1f',
        },
        paper: '#fbfaf7',
        ink: '#1d2524',
        clear: { DEFAULT: '#1f7a4d', soft: '#e3f3ea' },
        attention: { DEFAULT: '#9a6100', soft: '#fbf0d9' },
        blocked: { DEFAULT: '#b3261e', soft: '#fbe4e2' },
      },
    },
  },
  plugins: [],
};
