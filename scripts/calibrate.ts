/**
 * `npm run calibrate`: runs the engine on every published anchor (src/lib/care/calibration),
 * prints the table and rewrites it in docs/calibration.md. `--check` leaves the file alone and
 * fails when it is out of date. Exits 1 when an anchor falls outside without a stated reason, or
 * a known miss has come inside (so the doc can be corrected).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { calibrationBlock, calibrationFailures, figuresMet, runCalibration, withTable } from '../src/lib/care/calibration/run';

const DOC = new URL('../docs/calibration.md', import.meta.url);
const results = runCalibration();
const block = calibrationBlock(results);
console.log(block);

const { figures, met } = figuresMet(results);
const otherReadings = results.filter((r) => r.check.otherReadingOf && !r.inside).length;
console.log(
	`\n${met} of ${figures} checks inside their published range` +
		(otherReadings ? ` (and ${otherReadings} other reading(s) of a figure that is met, not met on that reading: see docs/calibration.md)` : '') +
		'.'
);

const failures = calibrationFailures(results);
for (const f of failures) console.error(`calibration: ${f}`);

const doc = readFileSync(DOC, 'utf8');
const fresh = withTable(doc, block);
if (process.argv.includes('--check')) {
	if (fresh !== doc) {
		console.error('docs/calibration.md is out of date: run npm run calibrate');
		process.exitCode = 1;
	}
} else if (fresh !== doc) {
	writeFileSync(DOC, fresh);
	console.log('docs/calibration.md updated.');
}
if (failures.length > 0) process.exitCode = 1;
