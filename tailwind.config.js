/** Tackline's palette is named after dyes and workroom materials. @type {import('tailwindcss').Config} */
export default {
	content: ['./src/**/*.{html,js,svelte,ts}'],
	theme: {
		extend: {
			fontFamily: {
				sans: ['Poppins', 'ui-sans-serif', 'system-ui', 'sans-serif']
			},
			colors: {
				linen: {
					50: '#fcfaf6',
					100: '#f7f2e9',
					200: '#ede4d3',
					300: '#ddd0b6',
					400: '#c4b293'
				},
				ink: {
					400: '#7b7f8c',
					500: '#5d6170',
					600: '#474b59',
					700: '#343845',
					800: '#242733',
					900: '#171923'
				},
				madder: {
					50: '#fdf3f0',
					100: '#fae2da',
					200: '#f3c1b2',
					300: '#e99880',
					400: '#db6b4f',
					500: '#c84d31',
					600: '#a93c25',
					700: '#8a3120',
					800: '#6c2a1e',
					900: '#4b1e16'
				},
				woad: {
					50: '#eff5f7',
					100: '#d8e7ec',
					200: '#afcdd8',
					300: '#7fadbe',
					400: '#4f8aa1',
					500: '#356f87',
					600: '#2a5a6f',
					700: '#24495a',
					800: '#1f3c4a',
					900: '#162b35'
				},
				weld: {
					100: '#fbf1cf',
					300: '#f0d268',
					600: '#8f6a07',
					800: '#5b4306'
				},
				moss: {
					100: '#e3f0df',
					600: '#3f6b35',
					800: '#2a4824'
				}
			},
			fontSize: {
				// a 1.2 (minor third) scale from 16 px
				xs: ['0.75rem', { lineHeight: '1.1rem' }],
				sm: ['0.875rem', { lineHeight: '1.35rem' }],
				base: ['1rem', { lineHeight: '1.6rem' }],
				lg: ['1.2rem', { lineHeight: '1.8rem' }],
				xl: ['1.44rem', { lineHeight: '2rem' }],
				'2xl': ['1.728rem', { lineHeight: '2.3rem' }],
				'3xl': ['2.074rem', { lineHeight: '2.6rem' }],
				'4xl': ['2.488rem', { lineHeight: '3rem' }]
			},
			borderRadius: {
				card: '0.875rem'
			}
		}
	},
	plugins: []
};
