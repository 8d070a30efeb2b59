import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { computePlan, type PlanResult } from '$lib/plan';
import { formatSmall, formatVolume } from '$lib/plan-view';
import demo from '../../../../fixtures/demo-plans.json';
import { mkdirSync, writeFileSync } from 'node:fs';
import { pdfPagePixels, pdfPagePng, pdfPageText, pdfText as extractText } from '../../../../tests/pdf-text';
import { buildCardItems } from '$lib/plan-view/buildCard';
import { layoutDrawing } from '$lib/plan-view/layoutDrawing';
import { layoutSheet } from '$lib/plan/layout-sheet';
import { pdfText, planPdf, woffToSfnt } from './planPdf';
import { smallPatio } from '$lib/plan/test-plans';

const plans = demo.plans.map((p) => ({ id: p.id, name: p.input.name, result: computePlan(p.input) }));

/** The PDF's text as pdf.js reads it, runs of white space folded (pdf.js turns µ into Greek μ). */
const textOf = async (pdf: Uint8Array) => (await extractText(pdf)).replace(/[ \t\n]+/g, ' ').replaceAll('\u03bc', '\u00b5');

const covered = (cp: number) => cp <= 0xff || cp === 0x2212 || (cp >= 0x2000 && cp <= 0x206f);

describe('planPdf', () => {
	it.each(plans)('$id: a PDF with Nunito embedded and the plan numbers in its text', { timeout: 30_000 }, async ({ name, result }) => {
		const pdf = await planPdf({ name, result, createdAt: new Date('2027-04-01T12:00:00Z') });
		const raw = Buffer.from(pdf).toString('latin1');
		expect(raw.startsWith('%PDF-')).toBe(true);
		expect(raw).toContain('/FontFile2');
		expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Nunito-Regular/);
		expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Nunito-ExtraBold/);
		// Every character is drawn in Nunito: no standard font got in.
		expect(raw).not.toMatch(/\/BaseFont \/Helvetica/);

		const text = await textOf(pdf);
		const u = result.units;
		expect(text).toContain(name);
		expect(text).toContain(formatVolume(result.volume.net, u));
		expect(text).toContain(formatVolume(result.volume.order, u));
		for (const b of result.bags) expect(text).toContain(`${b.count} bags`);
		const planned = result.mixing.sections.map((s) => `${s.bags} × ${result.mixing.bag.size} ${result.mixing.bag.unit}`);
		for (const p of planned) expect(text).toContain(p);
		for (const s of result.elevations.stakes) expect(text).toContain(pdfText(formatSmall(s.belowLevelLine, u), covered));
		for (const c of result.cautions) expect(text).toContain(pdfText(c.source, covered));
		expect(text).toContain(result.cautions.find((c) => c.id === 'local-codes')!.title);
		expect(text).not.toContain('\u0000'); // no glyph the font lacks
		expect(text).not.toContain('\uFFFD');
	});

	it("does not find another plan's volume: the text check can fail", async () => {
		const [a, b] = plans;
		const other = formatVolume(b.result.volume.order, b.result.units);
		expect(other).not.toBe(formatVolume(a.result.volume.order, a.result.units));
		const text = await textOf(await planPdf({ name: a.name, result: a.result }));
		expect(text).toContain(formatVolume(a.result.volume.order, a.result.units));
		expect(text).not.toContain(other);
	});

	it.each(plans)('$id: the first page holds the build card numbers and a drawing that renders', { timeout: 60_000 }, async ({ name, result }) => {
		const pdf = await planPdf({ name, result, madeAt: new Date('2027-04-02T08:00:00Z') });
		const first = (await pdfPageText(pdf, 1)).replace(/[ \t\n]+/g, ' ');
		const u = result.units;
		// The numbers themselves, from the engine's slab block, as the card prints them.
		expect(first).toContain(`Slab thickness ${pdfText(formatSmall(result.slab.thickness, u), covered)}`);
		expect(first).toContain(`Dig depth ${pdfText(formatSmall(result.slab.digDepth, u), covered)}`);
		for (const item of buildCardItems(result)) expect(first).toContain(pdfText(item.value, covered).replace(/[ \t\n]+/g, ' '));
		expect(first).toContain('PDF made Fri, Apr 2, 2027');
		expect(first).toContain(`prices in ${result.currency}`);

		// Render page 1 with pdf.js and look inside the drawing's box: the slab's fill and the lines
		// over it make it far from blank, and the box below it is where the drawing ends.
		const px = await pdfPagePixels(pdf, 1);
		const fill = [0xee, 0xf5, 0xef];
		let slab = 0;
		let ink = 0;
		let lowest = 0;
		for (let y = 0; y < px.height; y++)
			for (let x = 0; x < px.width; x++) {
				const i = (y * px.width + x) * 4;
				const [r, g, b] = [px.data[i], px.data[i + 1], px.data[i + 2]];
				if (Math.abs(r - fill[0]) + Math.abs(g - fill[1]) + Math.abs(b - fill[2]) < 6) {
					slab++;
					lowest = Math.max(lowest, y);
				} else if (r < 200 || g < 200 || b < 200) ink++;
			}
		// The slab is drawn at least 150 pt across on a 612 pt page, so its fill covers thousands of pixels.
		const drawn = layoutDrawing(result, layoutSheet(result), { width: 504, height: 300 });
		expect(Math.max(...drawn.slabs.flat().map((p) => p[0])) - Math.min(...drawn.slabs.flat().map((p) => p[0]))).toBeGreaterThan(150);
		expect(slab).toBeGreaterThan(5000);
		expect(ink).toBeGreaterThan(5000);
		expect(lowest).toBeGreaterThan(px.height / 2); // below the build card, in the lower half
	});

	it.each(plans)('$id: page 1 rendered to a PNG to look at (test-results/screens/)', { timeout: 30_000 }, async ({ id, name, result }) => {
		const pdf = await planPdf({ name, result, createdAt: new Date('2027-04-01T12:00:00Z') });
		const png = await pdfPagePng(pdf, 1, 2);
		expect(png.subarray(1, 4).toString()).toBe('PNG');
		mkdirSync('test-results/screens', { recursive: true });
		writeFileSync(`test-results/screens/pdf-${id}-page-1.png`, png);
	});

	it.each([
		...plans,
		{
			id: 'freestanding pad',
			name: 'Shed pad',
			result: computePlan({
				...smallPatio(),
				name: 'Shed pad',
				houseEdge: null,
				slope: { highEdge: { section: 0, edge: 2 } }
			})
		}
	])('$id: the layout drawing and its legend share a page', { timeout: 30_000 }, async ({ name, result }) => {
		const pdf = await planPdf({ name, result, createdAt: new Date('2027-04-01T12:00:00Z') });
		const pages = (
			Buffer.from(pdf)
				.toString('latin1')
				.match(/\/Type \/Page\b/g) ?? []
		).length;
		const texts = await Promise.all(Array.from({ length: pages }, (_, i) => pdfPageText(pdf, i + 1)));
		const at = texts.findIndex((t) => t.includes('Layout drawing'));
		expect(at).toBeGreaterThanOrEqual(0);
		expect(texts[at]).toContain(`Start at corner`);
	});

	it('uses Letter for imperial plans and A4 for metric ones', async () => {
		const size = async (r: PlanResult) =>
			/\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/
				.exec(Buffer.from(await planPdf({ name: 'x', result: r })).toString('latin1'))!
				.slice(1)
				.map(Number);
		const imperial = plans.find((p) => p.result.units === 'imperial')!.result;
		const metric = plans.find((p) => p.result.units === 'metric')!.result;
		expect(await size(imperial)).toEqual([612, 792]);
		expect((await size(metric)).map(Math.round)).toEqual([595, 842]);
	});
});

describe('pdfText', () => {
	it('spells out characters the latin subset lacks and keeps the ones it has', () => {
		expect(pdfText('1⅜ in', covered)).toBe('1 3/8 in');
		expect(pdfText('⅞ in', covered)).toBe('7/8 in');
		expect(pdfText('−1½ in, 2.24 yd³, ≥ 70 %', covered)).toBe('−1½ in, 2.24 yd³, >= 70 %');
		expect(pdfText('Δ', covered)).toBe('?');
	});
});

describe('woffToSfnt', () => {
	it('unwraps the fontsource WOFF into a TrueType file with the same tables', () => {
		const woff = readFileSync(createRequire(import.meta.url).resolve('@fontsource/nunito/files/nunito-latin-400-normal.woff'));
		const ttf = woffToSfnt(woff);
		expect(ttf.readUInt32BE(0)).toBe(0x00010000); // TrueType outlines
		expect(ttf.readUInt16BE(4)).toBe(woff.readUInt16BE(12));
		const tags = Array.from({ length: ttf.readUInt16BE(4) }, (_, i) => ttf.toString('latin1', 12 + i * 16, 16 + i * 16));
		expect(tags).toEqual(expect.arrayContaining(['cmap', 'glyf', 'head', 'hmtx', 'loca']));
		expect(() => woffToSfnt(ttf)).toThrow(/WOFF/);
	});
});
