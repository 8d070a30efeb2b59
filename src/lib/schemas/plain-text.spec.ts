import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { isPlainText, PLAIN_TEXT_MESSAGE } from '$lib/plan/text';

// Every schema module in this folder, so a new form schema is checked without being listed here.
const modules = import.meta.glob<Record<string, unknown>>(['./*.ts', '!./*.spec.ts'], { eager: true });

/** The object a schema validates, under any transform or pipe put around it. */
function objectOf(schema: unknown): z.ZodObject | null {
	let s = schema as z.ZodType;
	while (s instanceof z.ZodPipe) s = s.in as z.ZodType;
	return s instanceof z.ZodObject ? s : null;
}

const schemas = Object.entries(modules).flatMap(([file, mod]) =>
	Object.entries(mod).flatMap(([name, value]) => {
		const obj = objectOf(value);
		return obj ? [{ label: `${file.slice(2)} ${name}`, obj }] : [];
	})
);

describe('isPlainText', () => {
	it('accepts ordinary text, accents, emoji pairs, tabs and line breaks', () => {
		for (const s of ['Maren Lind', 'Zoë’s patio', 'slab 🧱 done', 'line one\nline two\r\n\tindented']) expect(isPlainText(s), s).toBe(true);
	});
	it('refuses NUL, other control characters and lone surrogates', () => {
		for (const s of ['a\u0000b', 'bell\u0007', 'esc\u001b[0m', 'del\u007f', 'half \uD83E', 'low \uDDF1 alone', '\uDDF1\uD83E'])
			expect(isPlainText(s), JSON.stringify(s)).toBe(false);
	});
});

describe('every form schema refuses text PostgreSQL cannot store', () => {
	it('finds the schemas', () => {
		expect(schemas.length).toBeGreaterThanOrEqual(10);
	});
	for (const { label, obj } of schemas) {
		it(label, () => {
			for (const [key, field] of Object.entries(obj.shape)) {
				// A plan's engine input: planInputSchema in $lib/plan checks its strings.
				const inner = field instanceof z.ZodOptional ? field.unwrap() : field;
				if (inner instanceof z.ZodUnknown) continue;
				for (const bad of ['Fern\u0000hollow', 'Fern\uD800hollow']) {
					const result = obj.safeParse({ [key]: bad });
					expect(result.success, `${key} ${JSON.stringify(bad)}`).toBe(false);
					const issues = result.error!.issues.filter((i) => i.path[0] === key);
					expect(issues.length, `${label}.${key} accepted ${JSON.stringify(bad)}`).toBeGreaterThan(0);
				}
			}
		});
	}
	it('says what is wrong with a free-text field', () => {
		const { signUpSchema } = modules['./account.ts'] as { signUpSchema: z.ZodObject };
		const result = signUpSchema.safeParse({ name: 'Ada\u0000', email: 'a@b.example', password: 'long enough pass', role: 'homeowner' });
		expect(result.error?.issues.map((i) => [i.path[0], i.message])).toEqual([['name', PLAIN_TEXT_MESSAGE]]);
	});
});
