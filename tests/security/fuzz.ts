/** What the fuzzing files share: the input nobody should trust, and the fields a zod schema reads. */
import fc from 'fast-check';
import { ID_MAX } from '../../src/lib/schema/fields';

/** Text an attacker (or a clumsy paste) sends: any, huge, binary, control characters, bidi overrides, look-alike digits. */
export const nastyText = fc.oneof(
	fc.string(),
	fc.string({ unit: 'grapheme' }),
	fc.string({ unit: 'binary', maxLength: 40 }),
	fc.string({ minLength: 3000, maxLength: 12000 }),
	fc.constantFrom(
		'\u0000',
		'a\u0000b',
		'Name\u202Egnp.exe',
		'\u2066x\u2069',
		'\r\nBcc: x@evil.test',
		'<script>alert(1)</script>',
		"' or 1=1 --",
		'../../etc/passwd',
		'%00',
		'-1',
		'1e309',
		String(ID_MAX + 1),
		'0x10',
		'\uFF12\uFF10\uFF12\uFF16-\uFF10\uFF11-\uFF10\uFF11',
		'\uD800',
		'\uFEFF',
		' ',
		''
	)
);

/** The keys of a zod object schema, through the pipes, transforms, refinements and unions around it (zod 4 keeps them in def.shape). */
export function schemaKeys(schema: unknown): string[] {
	const keys = new Set<string>();
	const walk = (s: unknown, depth = 0): void => {
		const def = (s as { _zod?: { def?: Record<string, unknown> } })?._zod?.def;
		if (!def || depth > 6) return;
		if (def.shape) for (const k of Object.keys(def.shape as object)) keys.add(k);
		for (const inner of [def.in, def.out, def.innerType, def.schema, ...((def.options as unknown[]) ?? [])]) if (inner) walk(inner, depth + 1);
	};
	walk(schema);
	if (keys.size === 0) throw new Error(`no object fields in a ${(schema as { _zod?: { def?: { type?: string } } })._zod?.def?.type} schema`);
	return [...keys];
}
