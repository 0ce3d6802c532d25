/**
 * How guessable a new password is, with zxcvbn-ts and its common-password and common-word
 * lists: the same check gives the hint beside the field as the user types and the server's
 * refusal. Context words (the person's e-mail and name, the nursery's name, the demo password)
 * count as the first guesses an attacker would try.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';

/** zxcvbn scores 0–4; 0 and 1 mean fewer than about a million guesses (every common password). */
export const MIN_SCORE = 2;

let factory: ZxcvbnFactory | undefined;
const checker = () => (factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs }));

/** Words, neighbouring words and all words run together, of each context value ("Kestrel Hollow Bananas" → kestrel, hollow, kestrelhollow, kestrelhollowbananas…). */
export function contextWords(values: (string | null | undefined)[]): string[] {
	const out = new Set<string>();
	for (const value of values) {
		if (!value) continue;
		const lower = value.toLowerCase();
		const parts = lower.split(/[^\p{L}\p{N}]+/u).filter((p) => p.length >= 3);
		out.add(lower);
		// An e-mail's part before the @ is what a person most often reuses.
		if (lower.includes('@')) out.add(lower.slice(0, lower.indexOf('@')));
		out.add(parts.join(''));
		parts.forEach((p, i) => {
			out.add(p);
			if (i > 0) out.add(parts[i - 1] + p);
		});
	}
	return [...out].filter(Boolean);
}

export interface Strength {
	score: 0 | 1 | 2 | 3 | 4;
	acceptable: boolean;
	/** What to change, in a sentence; empty when the password is fine. */
	advice: string;
}

const WARNINGS: Record<string, string> = {
	userInputs: 'It contains your name, your e-mail or the nursery’s name.',
	common: 'It is one of the most common passwords.',
	commonNames: 'Common names are easy to guess.',
	similarToCommon: 'It is a small change to a common password.',
	simpleRepeat: 'Repeats like “aaa” are easy to guess.',
	extendedRepeat: 'Repeated patterns are easy to guess.',
	sequences: 'Sequences like “abc” or “6543” are easy to guess.',
	keyPattern: 'Rows of keys on the keyboard are easy to guess.',
	straightRow: 'Rows of keys on the keyboard are easy to guess.',
	dates: 'Dates are easy to guess.',
	recentYears: 'Recent years are easy to guess.',
	wordByItself: 'A single word is easy to guess.'
};

export function assessPassword(password: string, context: string[] = []): Strength {
	const result = checker().check(password.slice(0, 128), context);
	const score = result.score as Strength['score'];
	const acceptable = score >= MIN_SCORE;
	const warning = result.feedback.warning ? (WARNINGS[result.feedback.warning] ?? 'It is easy to guess.') : '';
	const advice = acceptable ? '' : `${warning || 'It is easy to guess.'} Add a few more words, or choose an unusual phrase.`.trim();
	return { score, acceptable, advice };
}

/** Words for the five scores, shown beside the field as the user types. */
export const STRENGTH_WORDS = ['Very weak', 'Weak', 'Fair', 'Strong', 'Very strong'] as const;
