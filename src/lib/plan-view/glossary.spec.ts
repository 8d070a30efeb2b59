import { describe, expect, it } from 'vitest';
import { GLOSSARY } from './glossary';

describe('plain-language help', () => {
	it('explains every trade word the plan uses, once, and never says "from memory"', () => {
		const wanted = [
			'stake mark',
			'level line',
			'fall',
			'cross fall',
			'cold joint',
			'control joint',
			'isolation joint',
			'thickened edge',
			'working time',
			'equivalent age',
			'lifting limit',
			'modulus of rupture'
		];
		expect(GLOSSARY.map((g) => g.term.toLowerCase()).sort()).toEqual([...wanted].sort());
		for (const g of GLOSSARY) {
			expect(g.plain.length).toBeGreaterThan(40);
			expect(`${g.plain} ${g.source ?? ''}`).not.toMatch(/from memory/i);
		}
	});
});
