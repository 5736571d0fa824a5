import type { Config } from 'tailwindcss'

/** Tailwind v4 reads this file because app/globals.css names it with @config. */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['var(--font-inter)', 'system-ui', 'sans-serif'],
      },
      colors: {
        // The studio's own palette: warm linen, thread green, madder red.
        linen: { 50: '#fbf8f1', 100: '#f4ecd8', 200: '#e8dcbc' },
        thread: { 600: '#3f6b4f', 700: '#2f5540', 800: '#23402f' },
        madder: { 600: '#a3392b', 700: '#87291d' },
      },
    },
  },
}

export default config
