// convert-units 2 ships without types; only the chain used by these tests is declared.
declare module 'convert-units' {
	interface Converter {
		from(unit: string): { to(unit: string): number };
	}
	export default function convert(value: number): Converter;
}
