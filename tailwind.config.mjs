import defaultTheme from 'tailwindcss/defaultTheme';

/** Lapwing's workshop palette (see DEVELOPERS.md, "Look and feel"). */
export default {
  content: ['./src/**/*.{astro,html,js,jsx,ts,tsx,md}'],
  theme: {
    extend: {
      colors: {
        ink: '#1F2A2E',
        paper: '#FAF7F2',
        lapwing: { DEFAULT: '#2F6B4F', dark: '#24543E' },
        sawdust: '#E9D8B4',
        brick: '#B4442E',
        slate: '#5B6B73',
        wood: '#E8D3AC',
      },
      fontFamily: {
        sans: ['"DM Sans"', ...defaultTheme.fontFamily.sans],
      },
    },
  },
  plugins: [],
};
