import { describe, expect, it } from 'vitest';
import { formToObject, parseForm } from '../../../src/lib/schema/form';
import { z } from 'zod';

describe('a posted form as an object', () => {
	it('keeps repeated fields as a list', () => {
		const f = new FormData();
		f.append('stage', 'planted');
		f.append('stage', 'flowering');
		f.append('name', 'Pim');
		expect(formToObject(f)).toEqual({ stage: ['planted', 'flowering'], name: 'Pim' });
	});

	it('treats fields named like Object.prototype members as plain fields (the echo must stay serialisable)', () => {
		const f = new FormData();
		f.append('toString', 'x');
		f.append('constructor', 'y');
		f.append('__proto__', 'z');
		const values = formToObject(f);
		expect(values).toEqual(Object.fromEntries([['toString', 'x'], ['constructor', 'y']]));
		expect(Object.hasOwn(values, '__proto__')).toBe(false);
		expect(Object.values(values).every((v) => typeof v === 'string')).toBe(true);
		const parsed = parseForm(z.object({ name: z.string() }), f);
		expect(parsed.ok).toBe(false);
		expect(JSON.stringify(!parsed.ok && parsed.values)).toContain('"toString":"x"');
	});
});
