// Stakeline's colours, in one place: an outdoor palette that stays legible in sun glare (deep ink on
// warm paper, moss for actions, clay for cautions, sky for information). The page's CSS theme
// (app.css, through tailwind.palette.ts), the PDF, the SVG drawings and the 3D scene all read it.

/** The page's tokens: each is the Tailwind colour `--color-<name>` (bg-moss-600, text-ink-soft …). */
export const tokens = {
	paper: '#f7f4ec',
	card: '#ffffff',
	ink: '#1d2b25',
	'ink-soft': '#4a5a52',
	line: '#d9d3c4',

	'moss-50': '#eef5ef',
	'moss-100': '#d6e8da',
	'moss-300': '#8cbf9b',
	'moss-500': '#3f8a62',
	'moss-600': '#2f6b4f',
	'moss-700': '#245540',
	'moss-900': '#14301f',

	'clay-50': '#fbf0e8',
	'clay-100': '#f5dac6',
	'clay-500': '#b4562a',
	'clay-700': '#83391a',

	'sky-50': '#edf4f8',
	'sky-500': '#2f6f8f',
	'sky-700': '#1f4e66',

	'danger-50': '#fbecec',
	'danger-600': '#a32626'
} as const;

/** The tokens printed work uses (the PDF). */
export const print = {
	ink: tokens.ink,
	soft: tokens['ink-soft'],
	line: tokens.line,
	moss: tokens['moss-600'],
	mossLight: tokens['moss-50'],
	clay: tokens['clay-500'],
	danger: tokens['danger-600'],
	sky: tokens['sky-700']
} as const;

/**
 * Caution signal colours per ANSI Z535.1 (safety red and safety orange, approximate sRGB) and our
 * own information blue; ANSI Z535.4 sets which word goes with which.
 */
export const signal = { danger: '#c8102e', warning: '#e8730c', info: tokens['sky-700'] } as const;

/** The outline editor's drawing. */
export const outline = {
	grid: '#c9dccd',
	slab: '#e6e3da',
	slabSelected: '#d9d6cc',
	edge: tokens['ink-soft'],
	house: tokens['clay-700'],
	high: tokens['moss-600'],
	label: tokens.ink,
	joint: tokens.ink,
	coldJoint: tokens['sky-500'],
	corner: tokens['moss-600'],
	cornerFill: tokens.card
} as const;

/** The 3D preview: sky, lawn, light, and the materials of the slab and its forms. */
export const scene = {
	sky: '#cfe3ef',
	lawn: '#86ab6c',
	lightSky: '#fbf8f0',
	lightGround: '#5f7a4e',
	concrete: ['#b9b6ad', '#a9a69c'],
	thickened: '#8f8c83',
	forms: '#c4935a',
	stakes: '#8a5f36',
	house: '#e3d6bf',
	controlJoint: '#3d4640',
	// The caption and the 2D outline call cold joints blue; the fall arrow is dark green.
	coldJoint: '#2a7fc1',
	hidden: '#7d7a72',
	arrow: tokens['moss-900']
} as const;
