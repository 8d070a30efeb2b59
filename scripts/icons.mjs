// node scripts/icons.mjs — draws the app icons in static/ from one SVG (the favicon's slab and
// stakes), with sharp: 192 and 512 px for the manifest, a maskable 512 with the safe-zone margin,
// and the 180 px home-screen icon iOS asks for. Re-run after changing the drawing.
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';

const out = path.resolve(import.meta.dirname, '..', 'static');
/** The drawing on a 32-unit grid; `pad` shrinks it into the middle for the maskable safe zone. */
const svg = (round, pad = 0) => {
	const s = (32 - 2 * pad) / 32;
	return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32">
<rect width="32" height="32" rx="${round ? 7 : 0}" fill="#2f6b4f"/>
<g transform="translate(${pad} ${pad}) scale(${s})">
<path d="M6 22 L16 18 L26 20 L26 24 L16 22 L6 26 Z" fill="#f7f4ec"/>
<path d="M16 18 L16 22" stroke="#2f6b4f" stroke-width="0.8"/>
<path d="M9 8v13M23 8v12" stroke="#f5dac6" stroke-width="2.5" stroke-linecap="round"/>
<path d="M9 10 L23 10" stroke="#f5dac6" stroke-width="0.8" stroke-dasharray="1.2 0.8"/>
</g></svg>`;
};

fs.writeFileSync(path.join(out, 'icon.svg'), svg(true));
const png = (s, size, name) =>
	sharp(Buffer.from(s), { density: (72 * size) / 32 })
		.resize(size, size)
		.png()
		.toFile(path.join(out, name));
await png(svg(true), 192, 'icon-192.png');
await png(svg(true), 512, 'icon-512.png');
await png(svg(false, 4), 512, 'icon-maskable-512.png');
await png(svg(false), 180, 'apple-touch-icon.png');
console.log('icons written to static/');
