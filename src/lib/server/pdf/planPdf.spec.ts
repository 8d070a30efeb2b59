import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { computePlan, type PlanResult } from '$lib/plan';
import { formatSmall, formatVolume } from '$lib/plan/format';
import demo from '../../../../fixtures/demo-plans.json';
import { pdfText, planPdf } from './planPdf';

const plans = demo.plans.map((p) => ({ id: p.id, name: p.input.name, result: computePlan(p.input) }));

interface PdfObject {
	dict: string;
	stream?: Buffer;
}

/** Every indirect object, streams inflated, read by their /Length so binary data cannot confuse it. */
function objects(pdf: Uint8Array): Map<number, PdfObject> {
	const buf = Buffer.from(pdf);
	const s = buf.toString('latin1');
	const out = new Map<number, PdfObject>();
	const head = /(\d+) 0 obj/g;
	let m: RegExpExecArray | null;
	while ((m = head.exec(s))) {
		const start = m.index + m[0].length;
		const end = s.indexOf('endobj', start);
		const kw = s.indexOf('stream', start);
		if (kw === -1 || kw > end) {
			out.set(+m[1], { dict: s.slice(start, end) });
			continue;
		}
		const dict = s.slice(start, kw);
		const from = kw + 'stream'.length + (s[kw + 6] === '\r' ? 2 : 1);
		const raw = buf.subarray(from, from + Number(/\/Length (\d+)/.exec(dict)![1]));
		out.set(+m[1], { dict, stream: dict.includes('/FlateDecode') ? inflateSync(raw) : raw });
		head.lastIndex = from + raw.length;
	}
	return out;
}

/** Glyph codes to text, from a font's ToUnicode CMap (bfrange arrays and bfchar). */
function cmap(text: string): Map<number, string> {
	const map = new Map<number, string>();
	// A ligature maps to several code units, written with spaces: <0066 0069>.
	const hex = (h: string) => String.fromCodePoint(...(h.replace(/\s/g, '').match(/.{4}/g) ?? []).map((x) => parseInt(x, 16)));
	for (const [, lo, body] of text.matchAll(/<([0-9a-f]+)>\s*<[0-9a-f]+>\s*\[([^\]]*)\]/gi))
		[...body.matchAll(/<([0-9a-f\s]+)>/gi)].forEach(([, u], i) => map.set(parseInt(lo, 16) + i, hex(u)));
	for (const block of text.match(/beginbfchar([\s\S]*?)endbfchar/g) ?? [])
		for (const [, code, u] of block.matchAll(/<([0-9a-f]+)>\s*<([0-9a-f\s]+)>/gi)) map.set(parseInt(code, 16), hex(u));
	return map;
}

/** The text drawn on the pages, one line per text-showing operator. */
function pdfTextContent(pdf: Uint8Array): string {
	const objs = objects(pdf);
	const toUnicode = new Map<number, Map<number, string>>();
	for (const [n, o] of objs) {
		const ref = /\/Type \/Font[\s\S]*\/ToUnicode (\d+) 0 R/.exec(o.dict);
		if (ref) toUnicode.set(n, cmap(objs.get(+ref[1])!.stream!.toString('latin1')));
	}
	const fonts = new Map<string, Map<number, string>>();
	for (const o of objs.values())
		for (const [, name, n] of o.dict.matchAll(/\/(F\d+) (\d+) 0 R/g)) if (toUnicode.has(+n)) fonts.set(name, toUnicode.get(+n)!);
	const lines: string[] = [];
	for (const o of objs.values()) {
		const content = o.stream?.toString('latin1');
		if (!content?.includes(' Tf')) continue;
		let font: Map<number, string> | undefined;
		for (const [, name, tj, tj1] of content.matchAll(/\/(F\d+) [\d.]+ Tf|\[([^\]]*)\] TJ|<([0-9a-f]*)> Tj/gi)) {
			if (name) font = fonts.get(name);
			else {
				const strings = tj ? [...tj.matchAll(/<([0-9a-f]*)>/gi)].map((x) => x[1]) : [tj1];
				const codes = strings.flatMap((h) => (h.match(/.{4}/g) ?? []).map((x) => parseInt(x, 16)));
				lines.push(codes.map((c) => (c === 0 ? '\u0000' : (font?.get(c) ?? '\uFFFD'))).join(''));
			}
		}
	}
	return lines.join('\n');
}

const covered = (cp: number) => cp <= 0xff || cp === 0x2212 || (cp >= 0x2000 && cp <= 0x206f);

describe('planPdf', () => {
	it.each(plans)('$id: a PDF with Nunito embedded and the plan numbers in its text', async ({ name, result }) => {
		const pdf = await planPdf({ name, result, createdAt: new Date('2027-04-01T12:00:00Z') });
		const raw = Buffer.from(pdf).toString('latin1');
		expect(raw.startsWith('%PDF-')).toBe(true);
		expect(raw).toContain('/FontFile2');
		expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Nunito-Regular/);
		expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Nunito-ExtraBold/);
		// Every character is drawn in Nunito: no standard font got in.
		expect(raw).not.toMatch(/\/BaseFont \/Helvetica/);

		const text = pdfTextContent(pdf);
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
		const text = pdfTextContent(await planPdf({ name: a.name, result: a.result }));
		expect(text).toContain(formatVolume(a.result.volume.order, a.result.units));
		expect(text).not.toContain(other);
	});

	it('uses Letter for imperial plans and A4 for metric ones', async () => {
		const size = async (r: PlanResult) =>
			/\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/.exec(Buffer.from(await planPdf({ name: 'x', result: r })).toString('latin1'))!.slice(1).map(Number);
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
