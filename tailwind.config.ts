import type { Config } from 'tailwindcss'

// Our own palette: pine greens for the brand, clay for cautions, ridge blue for information,
// granite neutrals. Step kinds in timelines use these too (see components/routine).
export default <Partial<Config>>{
  content: [
    './components/**/*.{vue,ts}',
    './layouts/**/*.vue',
    './pages/**/*.vue',
    './app.vue',
    './composables/**/*.ts',
    './shared/**/*.ts',
  ],
  theme: {
    extend: {
      fontFamily: {
        sans: ['Lexend', 'system-ui', 'sans-serif'],
      },
      colors: {
        pine: {
          50: '#eff7f2', 100: '#d8ecdf', 200: '#b3d9c2', 300: '#84bf9e', 400: '#559f78',
          500: '#36825c', 600: '#266848', 700: '#1f533b', 800: '#1f4d3a', 900: '#163628',
        },
        clay: {
          50: '#fdf4ee', 100: '#fae4d4', 200: '#f4c5a6', 300: '#ec9f70', 400: '#e37842',
          500: '#d65d26', 600: '#b8471c', 700: '#91361a', 800: '#742e1b', 900: '#5e2819',
        },
        ridge: {
          50: '#eff6fb', 100: '#dbeaf5', 200: '#bcd8ec', 300: '#8ebedf', 400: '#5b9ccd',
          500: '#3a7fb8', 600: '#2a659a', 700: '#24527d', 800: '#224668', 900: '#1f3b57',
        },
        granite: {
          50: '#f6f6f4', 100: '#e9e8e4', 200: '#d4d2cb', 300: '#b6b3a8', 400: '#959184',
          500: '#6b675c', 600: '#615e54', 700: '#4f4c45', 800: '#3f3d38', 900: '#2a2926',
        },
      },
      fontSize: {
        // A type scale that stays legible at arm's length on a phone.
        step: ['clamp(2.25rem, 9vw, 4.5rem)', { lineHeight: '1.05', fontWeight: '600' }],
        clock: ['clamp(4.5rem, 24vw, 11rem)', { lineHeight: '1', fontWeight: '600' }],
      },
    },
  },
}
