/**
 * Benchmark of computePlan: one three-generation plan vs batches of 1k, 10k and 100k plans.
 * Run: npx tsx bench/plan.ts
 * Inputs cycle through the catalogue so each batch sees every cultivar and climate.
 */
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { climates, computePlan, cultivars, type PlanInput } from '../src/lib/care/index';

function inputFor(i: number): PlanInput {
	const month = (i % 12) + 1;
	const day = (i % 28) + 1;
	return {
		cultivar: cultivars[i % cultivars.length],
		climate: climates[i % climates.length],
		plantedOn: `${2020 + (i % 11)}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`,
		ageAtPlantingWeeks: i % 105,
		units: i % 2 === 0 ? 'metric' : 'imperial',
		generations: 3
	};
}

const inputs = Array.from({ length: 1000 }, (_, i) => inputFor(i));
let sink = 0;

function single(): number {
	const samples: number[] = [];
	for (let i = 0; i < 2000; i++) computePlan(inputs[i % inputs.length]); // warm-up
	for (let i = 0; i < 5000; i++) {
		const input = inputs[i % inputs.length];
		const t0 = performance.now();
		sink += computePlan(input).steps.length;
		samples.push(performance.now() - t0);
	}
	samples.sort((a, b) => a - b);
	return samples[samples.length >> 1];
}

function batch(n: number): number {
	const t0 = performance.now();
	for (let i = 0; i < n; i++) sink += computePlan(inputs[i % inputs.length]).steps.length;
	return performance.now() - t0;
}

const singleMs = single();
const rows = [1_000, 10_000, 100_000].map((n) => {
	const totalMs = batch(n);
	return { n, totalMs, perPlanMs: totalMs / n, ratio: totalMs / n / singleMs };
});

const lines = [
	`node ${process.version}, ${os.cpus()[0]?.model ?? 'unknown cpu'}, ${os.cpus().length} cores, ${os.platform()} ${os.arch()}`,
	`single three-generation plan (median of 5000 runs after 2000 warm-up): ${(singleMs * 1000).toFixed(1)} µs`,
	'',
	'| batch | total | per plan | per plan / single |',
	'|---:|---:|---:|---:|',
	...rows.map((r) => `| ${r.n.toLocaleString('en-US')} | ${(r.totalMs / 1000).toFixed(2)} s | ${(r.perPlanMs * 1000).toFixed(1)} µs | ${r.ratio.toFixed(2)} |`),
	'',
	`(steps produced, to keep the work observable: ${sink})`
];
console.log(lines.join('\n'));
