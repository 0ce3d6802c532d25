import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

// A merge committed with its conflict markers still in a file once slipped through: a Markdown or
// comment block does not fail the type check, so this looks for them in every tracked text file.
const MARKER = /^(<{7}|>{7}) |^={7}$/m;
const TEXT = /\.(ts|js|mjs|svelte|md|json|css|html|sql|yml|yaml|txt)$/;

describe('the repository', () => {
	it('holds no unresolved merge-conflict markers', () => {
		const files = execFileSync('git', ['ls-files'], { encoding: 'utf8' })
			.split('\n')
			.filter((f) => TEXT.test(f));
		expect(files.length).toBeGreaterThan(100);
		const marked = files.filter((f) => {
			try {
				return MARKER.test(readFileSync(f, 'utf8'));
			} catch {
				return false; // listed but deleted in the working tree
			}
		});
		expect(marked).toEqual([]);
	});
});
