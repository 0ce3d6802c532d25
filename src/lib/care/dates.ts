/**
 * Calendar-date arithmetic on whole days since 1970-01-01 (proleptic Gregorian).
 * Plans are about calendar days in the garden, so nothing here touches clocks or time zones.
 */

export type EpochDay = number;

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

export function isLeapYear(year: number): boolean {
	return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

const MONTH_LENGTHS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

export function daysInMonth(year: number, month: number): number {
	return month === 2 && isLeapYear(year) ? 29 : MONTH_LENGTHS[month - 1];
}

/** Days-from-civil (H. Hinnant's algorithm): exact for every Gregorian date, no Date object needed. */
export function epochDayFromCivil(year: number, month: number, day: number): EpochDay {
	const y = month <= 2 ? year - 1 : year;
	const era = Math.floor(y / 400);
	const yoe = y - era * 400;
	const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
	const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
	return era * 146097 + doe - 719468;
}

export interface CivilDate {
	year: number;
	month: number;
	day: number;
}

export function civilFromEpochDay(epochDay: EpochDay): CivilDate {
	const z = epochDay + 719468;
	const era = Math.floor(z / 146097);
	const doe = z - era * 146097;
	const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
	const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
	const mp = Math.floor((5 * doy + 2) / 153);
	const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
	const month = mp < 10 ? mp + 3 : mp - 9;
	const year = yoe + era * 400 + (month <= 2 ? 1 : 0);
	return { year, month, day };
}

export function parseIsoDate(iso: string): EpochDay {
	const match = ISO_DATE.exec(iso);
	if (!match) throw new RangeError(`Not a YYYY-MM-DD date: ${JSON.stringify(iso)}`);
	const year = Number(match[1]);
	const month = Number(match[2]);
	const day = Number(match[3]);
	if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
		throw new RangeError(`No such calendar date: ${iso}`);
	}
	return epochDayFromCivil(year, month, day);
}

function pad(n: number, width: number): string {
	return String(n).padStart(width, '0');
}

export function formatIsoDate(epochDay: EpochDay): string {
	const { year, month, day } = civilFromEpochDay(epochDay);
	return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

/** Same day-of-month `months` later; clamped to the month's end so Jan 31 + 1 month is Feb 28/29. */
export function addMonths(epochDay: EpochDay, months: number): EpochDay {
	const { year, month, day } = civilFromEpochDay(epochDay);
	const index = year * 12 + (month - 1) + months;
	const y = Math.floor(index / 12);
	const m = index - y * 12 + 1;
	return epochDayFromCivil(y, m, Math.min(day, daysInMonth(y, m)));
}

export function monthOf(epochDay: EpochDay): number {
	return civilFromEpochDay(epochDay).month;
}
