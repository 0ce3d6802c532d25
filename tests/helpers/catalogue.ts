/** Form values the catalogue and settings tests start from and then spoil one field at a time. */
export const SETTINGS_FIELDS: Record<string, string> = {
	name: 'Kestrel Hollow Bananas',
	town: 'Marrowby',
	market: 'Marrowby Quay Saturday Market',
	timeZone: 'UTC',
	units: 'metric',
	defaultClimate: 'south-florida-coast',
	fertilizerName: 'Banana mix',
	npkN: '8',
	npkP: '10',
	npkK: '16',
	fullRationG: '907',
	handfulG: '100',
	nitrogenCapKgPer100m2: ''
};

/** Twelve warm monthly means, January first, as typed into the form. */
export const WARM_MEANS = ['19', '19.5', '21', '23', '25', '27', '28', '28', '27', '25', '22', '20'];
