// The page's colour theme from the one palette module: app.css loads this with `@config`, so every
// colour utility (bg-moss-600, text-ink-soft …) and every `--color-*` variable on :root comes from
// lib/palette.ts.
import { tokens } from './lib/palette';

const variables = Object.fromEntries(Object.entries(tokens).map(([name, value]) => [`--color-${name}`, value]));

export default {
	theme: { extend: { colors: tokens } },
	plugins: [{ handler: ({ addBase }: { addBase: (css: Record<string, Record<string, string>>) => void }) => addBase({ ':root': variables }) }]
};
