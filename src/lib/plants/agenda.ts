/**
 * "This week" and "next week" on the plant page: the steps whose window is open in each week,
 * not yet logged. A window that spans both weeks is shown in the first only.
 */
import type { IsoDate, Step } from '$lib/care';
import { formatIsoDate, parseIsoDate } from '$lib/care';

export interface Agenda {
	thisWeek: Step[];
	nextWeek: Step[];
}

export function agendaFor(steps: readonly Step[], today: IsoDate): Agenda {
	const day = parseIsoDate(today);
	const at = (offset: number) => formatIsoDate(day + offset);
	const open = (s: Step, from: IsoDate, to: IsoDate) => !s.observed && s.earliest <= to && s.latest >= from;
	const thisWeek = steps.filter((s) => open(s, today, at(6)));
	const nextWeek = steps.filter((s) => !thisWeek.includes(s) && open(s, at(7), at(13)));
	return { thisWeek, nextWeek };
}
