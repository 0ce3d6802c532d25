/**
 * What an owner's edit of a cultivar changes, field by field: the rows of its history and the new
 * values to store. Pure: no database. A plan parameter whose value changes becomes the nursery's
 * own (`{ kind: 'nursery', note? }`); one left as it was keeps its source.
 */
import { CULTIVAR_PARAMETER_BOUNDS, CULTIVAR_PARAMETER_NAMES, type CultivarParameterName, type Provenance, type Sourced } from '$lib/care';

export interface EditableCultivar {
	name: string;
	group: string;
	subgroup: string;
	size: string;
	notes: string;
	usualPriceCents: number | null;
	parameters: Record<string, Sourced<number>>;
}

export type CultivarEdit = Omit<EditableCultivar, 'parameters' | 'usualPriceCents'> & {
	usualPrice?: number;
	sourceNote: string;
} & Record<CultivarParameterName, number>;

export interface FieldChange {
	field: string;
	oldValue: unknown;
	newValue: unknown;
}

const PLAIN_FIELDS = ['name', 'group', 'subgroup', 'size', 'notes'] as const;

/** Price in the currency's main unit → cents, without float drift (12.5 → 1250). */
export const toCents = (price: number | undefined): number | null => (price === undefined ? null : Math.round(price * 100));

export function nurserySource(note: string): Provenance {
	return note ? { kind: 'nursery', note } : { kind: 'nursery' };
}

/** The stored values after the edit, and one change row per field that moved. */
export function applyCultivarEdit(current: EditableCultivar, edit: CultivarEdit): { next: EditableCultivar; changes: FieldChange[] } {
	const changes: FieldChange[] = [];
	const next: EditableCultivar = { ...current, parameters: { ...current.parameters } };
	for (const field of PLAIN_FIELDS) {
		if (current[field] !== edit[field]) {
			changes.push({ field, oldValue: current[field], newValue: edit[field] });
			next[field] = edit[field];
		}
	}
	const cents = toCents(edit.usualPrice);
	if (cents !== current.usualPriceCents) {
		changes.push({ field: 'usualPriceCents', oldValue: current.usualPriceCents, newValue: cents });
		next.usualPriceCents = cents;
	}
	for (const name of CULTIVAR_PARAMETER_NAMES) {
		const before = current.parameters[name];
		if (before?.value === edit[name]) continue;
		const after: Sourced<number> = { value: edit[name], source: nurserySource(edit.sourceNote) };
		changes.push({ field: name, oldValue: before ?? null, newValue: after });
		next.parameters[name] = after;
	}
	return { next, changes };
}

/** A new cultivar of the nursery's own: every parameter is the nursery's. */
export function newCultivarParameters(edit: CultivarEdit): Record<string, Sourced<number>> {
	return Object.fromEntries(CULTIVAR_PARAMETER_NAMES.map((name) => [name, { value: edit[name], source: nurserySource(edit.sourceNote) }]));
}

/** A slug from a name: lowercase words joined by hyphens, ASCII only ("Kestrel Red №2" → "kestrel-red-2"). */
export function slugify(name: string, maxLength = 60): string {
	const slug = name
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, maxLength)
		.replace(/-+$/g, '');
	return slug || 'cultivar';
}

const FIELD_LABELS: Record<string, string> = {
	name: 'Name',
	group: 'Genome group',
	subgroup: 'Subgroup',
	size: 'Size',
	notes: 'Notes',
	usualPriceCents: 'Usual price',
	retired: 'Sale',
	created: 'Added'
};

/** The history's wording of a field name. */
export const fieldLabel = (field: string): string => FIELD_LABELS[field] ?? CULTIVAR_PARAMETER_BOUNDS[field as CultivarParameterName]?.label ?? field;

/** The history's wording of a stored value. */
export function valueText(field: string, value: unknown): string {
	if (value === null || value === undefined || value === '') return '—';
	if (field === 'usualPriceCents' && typeof value === 'number') return (value / 100).toFixed(2);
	if (field === 'retired') return value ? 'retired from sale' : 'on sale';
	const bound = CULTIVAR_PARAMETER_BOUNDS[field as CultivarParameterName];
	if (bound && typeof value === 'object' && 'value' in (value as object)) {
		const s = value as Sourced<number>;
		return `${s.value} ${bound.unit} (${sourceText(s.source)})`;
	}
	return String(value);
}

export function sourceText(source: Provenance): string {
	switch (source.kind) {
		case 'published':
			return `published: ${source.citation}`;
		case 'common-practice':
			return 'common practice, no source';
		case 'from-memory':
			return source.note ? `from memory: ${source.note}` : 'from memory';
		case 'nursery':
			return source.note ? `the nursery's own: ${source.note}` : "the nursery's own";
	}
}

/** A stored cultivar as the form's text inputs. */
export function cultivarFormValues(c: EditableCultivar): Record<string, string> {
	const values: Record<string, string> = {
		name: c.name,
		group: c.group,
		subgroup: c.subgroup,
		size: c.size,
		notes: c.notes,
		usualPrice: c.usualPriceCents === null ? '' : (c.usualPriceCents / 100).toFixed(2),
		sourceNote: ''
	};
	for (const name of CULTIVAR_PARAMETER_NAMES) values[name] = c.parameters[name] ? String(c.parameters[name].value) : '';
	return values;
}

/** How many of a cultivar's plan parameters are the nursery's own values. */
export const ownValueCount = (parameters: Record<string, Sourced<number>>): number => Object.values(parameters).filter((p) => p.source.kind === 'nursery').length;
