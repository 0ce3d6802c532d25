// The owner keeps the catalogue and the settings on a phone; every new form refuses bad input without writing.
import { sql } from 'drizzle-orm';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { baseUrl, expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { SETTINGS_FIELDS, WARM_MEANS } from '../helpers/catalogue';

const PHONE = { width: 360, height: 780 };
/** Each walk signs in and runs axe several times: on a shared 2-core machine that takes longer than one page's budget. */
const PHONE_STEPS_MS = 180_000;
const long = (n: number) => 'a'.repeat(n);
const means = WARM_MEANS;

/** Everything an owner's form could write, so a refusal can be shown to have written nothing. */
async function catalogueState() {
	const rows = await db.execute<{ state: string }>(sql`select json_build_object(
		'cultivars', (select json_agg(c order by c.id) from cultivars c),
		'changes', (select count(*) from cultivar_changes),
		'climates', (select json_agg(p order by p.id) from climate_profiles p),
		'settings', (select row_to_json(s) from nursery_settings s),
		'version', (select version from catalogue_version))::text as state`);
	return [...rows][0]!.state;
}

async function submit(action: string, fields: Record<string, string | string[]>, cookie: string) {
	const body = new URLSearchParams();
	for (const [k, v] of Object.entries(fields)) for (const one of [v].flat()) body.append(k, one);
	return fetch(`${baseUrl()}${action}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), cookie },
		body
	});
}

let browser: Browser;
let owner = '';
beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const res = await submit('/login?/signin', { email: DEMO_ACCOUNTS[0].email, password: DEMO_PASSWORD }, '');
	owner = res.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='))!.split(';')[0];
	browser = await launch();
});
afterAll(async () => browser?.close());

const cultivar = { name: 'Kestrel Red', group: 'AAA', subgroup: 'Red', size: 'tall', notes: '', usualPrice: '12.50', matureHeightM: '4', coldDamageC: '13', leavesToShooting: '58', degreeDaysShootingToHarvest: '1000', leafRateFactor: '0.9', bunchMassKg: '20', sourceNote: '' };
const settings = SETTINGS_FIELDS;

const cases: { form: string; action: string; fields: Record<string, string | string[]>; field: string }[] = [
	{ form: 'add cultivar', action: '/nursery/cultivars/new', fields: { ...cultivar, name: '' }, field: 'name' },
	{ form: 'add cultivar', action: '/nursery/cultivars/new', fields: { ...cultivar, name: long(81) }, field: 'name' },
	{ form: 'add cultivar', action: '/nursery/cultivars/new', fields: { ...cultivar, leavesToShooting: '999' }, field: 'leavesToShooting' },
	{ form: 'add cultivar', action: '/nursery/cultivars/new', fields: { ...cultivar, bunchMassKg: 'heavy' }, field: 'bunchMassKg' },
	{ form: 'edit cultivar', action: '/nursery/cultivars/williams?/save', fields: { ...cultivar, subgroup: long(61) }, field: 'subgroup' },
	{ form: 'edit cultivar', action: '/nursery/cultivars/williams?/save', fields: { ...cultivar, degreeDaysShootingToHarvest: '10' }, field: 'degreeDaysShootingToHarvest' },
	{ form: 'edit cultivar', action: '/nursery/cultivars/williams?/save', fields: { ...cultivar, usualPrice: 'twelve' }, field: 'usualPrice' },
	{ form: 'edit cultivar', action: '/nursery/cultivars/williams?/save', fields: { ...cultivar, leafRateFactor: '' }, field: 'leafRateFactor' },
	{ form: 'retire', action: '/nursery/cultivars/williams?/retire', fields: { retire: 'maybe' }, field: 'retire' },
	{ form: 'add climate', action: '/nursery/climates', fields: { name: '', monthlyMeanC: means, sourceNote: 'station' }, field: 'name' },
	{ form: 'add climate', action: '/nursery/climates', fields: { name: 'Valley', monthlyMeanC: [...means.slice(0, 3), 'warm', ...means.slice(4)], sourceNote: 'station' }, field: 'monthlyMeanC-3' },
	{ form: 'add climate', action: '/nursery/climates', fields: { name: 'Valley', monthlyMeanC: means.map(() => '60'), sourceNote: 'station' }, field: 'monthlyMeanC-0' },
	{ form: 'add climate', action: '/nursery/climates', fields: { name: 'Valley', monthlyMeanC: means, sourceNote: long(301) }, field: 'sourceNote' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, name: '' }, field: 'name' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, market: long(121) }, field: 'market' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, timeZone: 'Mars/Olympus' }, field: 'timeZone' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, npkN: 'ten' }, field: 'npkN' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, fullRationG: '99999' }, field: 'fullRationG' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, nitrogenCapKgPer100m2: '-1' }, field: 'nitrogenCapKgPer100m2' },
	{ form: 'settings', action: '/nursery/settings', fields: { ...settings, defaultClimate: 'atlantis' }, field: 'defaultClimate' }
];

describe('bad input on the catalogue and settings forms', () => {
	for (const c of cases) {
		it(`${c.form}: ${c.field} is refused with 400 and nothing is written`, async () => {
			const before = await catalogueState();
			const res = await submit(c.action, c.fields, owner);
			expect(res.status).toBe(400);
			const html = await res.text();
			expect(html.includes(`field-${c.field}-error`) || (c.field === 'retire' && html.includes('role="alert"')), html.slice(0, 200)).toBe(true);
			expect(await catalogueState()).toBe(before);
		});
	}
});

describe('the owner on a phone', () => {
	it('edits a cultivar, sees the change in its history, retires it after confirming and puts it back', async () => {
		const page = await (await newContext(browser, PHONE)).newPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery');
		await page.getByRole('link', { name: 'Cultivars', exact: true }).click();
		await page.waitForURL(/\/nursery\/cultivars$/);
		await expectAccessible(page);
		await page.getByRole('link', { name: 'Williams' }).click();
		await page.waitForURL(/\/nursery\/cultivars\/williams$/);
		await page.waitForLoadState('networkidle');
		await page.getByLabel('Leaves to shooting (leaves)').fill('52');
		await page.getByLabel(/Where the changed values come from/).fill('our 2025 records');
		await page.getByRole('button', { name: 'Save changes' }).click();
		await page.getByText('Saved 1 change').waitFor();
		const history = page.getByRole('region', { name: /History/ });
		await history.getByText(/Leaves to shooting/).first().waitFor();
		expect(await history.textContent()).toMatch(/56 leaves .*→ 52 leaves \(the nursery's own: our 2025 records\)/);
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
		await expectAccessible(page);

		await page.getByRole('link', { name: 'Retire from sale…' }).click();
		await page.getByRole('button', { name: 'Yes, retire it' }).click();
		await page.getByText('Williams is retired from sale').waitFor();
		const planner = await fetch(`${baseUrl()}/planner`).then((r) => r.text());
		expect(planner).not.toContain('value="williams"');
		await page.getByRole('button', { name: 'Put back on sale' }).click();
		await page.getByText('Williams is on sale again').waitFor();
	}, PHONE_STEPS_MS);

	it('sets the time zone, fertilizer and a restricted month in the settings, beside the cautions', async () => {
		const page = await (await newContext(browser, PHONE)).newPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery/settings');
		expect(await page.getByRole('note').first().textContent()).toMatch(/gloves.*Local rules come first/s);
		await page.getByLabel('Time zone').selectOption('Pacific/Auckland');
		await page.getByLabel('Fertilizer name').fill('Kestrel Hollow banana mix 10-5-20');
		await page.getByLabel('N', { exact: true }).fill('10');
		await page.getByLabel('P₂O₅').fill('5');
		await page.getByLabel('K₂O').fill('20');
		await page.getByLabel('July').check();
		await page.getByRole('button', { name: 'Save settings' }).click();
		await page.getByText('Settings saved').waitFor();
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
		await expectAccessible(page);
		const preview = await fetch(`${baseUrl()}/api/v1/plan-preview`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ cultivar: 'grand-nain', plantedOn: '2027-03-01', ageAtPlantingWeeks: 12, climate: 'south-florida-coast' })
		}).then((r) => r.json() as Promise<{ steps: { kind: string; likely: string; restricted?: unknown }[] }>);
		const july = preview.steps.filter((s) => s.kind === 'feeding' && s.likely.slice(5, 7) === '07');
		expect(july.length).toBeGreaterThan(0);
		for (const s of july) expect(s.restricted).toBeTruthy();
	}, PHONE_STEPS_MS);
});
