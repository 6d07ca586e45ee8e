import type { Config } from 'tailwindcss'

// Scholium's own palette: ink on vellum, with a verdigris accent for what
// holds and a madder red for what does not. Verdict colours are never the
// only signal: every mark also carries a glyph and a word.
export default {
  content: ['./components/**/*.vue', './layouts/**/*.vue', './pages/**/*.vue', './app.vue', './error.vue'],
  theme: {
    extend: {
      colors: {
        vellum: { 50: '#fbf8f1', 100: '#f5efe1', 200: '#ebe1c8', 300: '#dccba3' },
        ink: { 400: '#6b6457', 600: '#433d33', 800: '#26221c', 900: '#17140f' },
        verdigris: { 100: '#dcefe8', 500: '#2f7d6b', 700: '#1f5a4c' },
        madder: { 100: '#f6dedb', 500: '#a3392b', 700: '#7a2419' },
        ochre: { 100: '#f5ead0', 500: '#b07d1c', 700: '#7f5810' },
        slateblue: { 100: '#e1e4f2', 500: '#4c5a9a', 700: '#323d70' },
      },
      fontFamily: {
        serif: ['"Crimson Pro"', 'Georgia', 'serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
      },
    },
  },
  plugins: [],
} satisfies Config
