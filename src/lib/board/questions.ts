/** Rules of the question board that need no database. */
import type { QuestionState } from './vocabulary';

/** How an asker is shown in public: the first name only, or initials when the first word is one letter. */
export function publicAskerName(fullName: string): string {
	const words = fullName.trim().split(/\s+/).filter(Boolean);
	if (words.length === 0) return 'A gardener';
	const first = words[0].replace(/[^\p{L}\p{M}'-]/gu, '');
	if (first.length >= 2) return first.slice(0, 30);
	const initials = words.map((w) => w[0]?.toUpperCase()).filter((c) => c && /\p{L}/u.test(c)).join('.');
	return initials ? `${initials}.` : 'A gardener';
}

/** Who may see a question: the asker and staff always; everyone else only a public one with an answer. */
export function canSee(q: { askerId: number; isPublic: boolean; state: QuestionState }, viewer: { id: number; role: string } | null): boolean {
	if (viewer && (viewer.role === 'owner' || viewer.role === 'staff')) return true;
	if (viewer && viewer.id === q.askerId) return q.state !== 'hidden';
	return q.isPublic && (q.state === 'answered' || q.state === 'resolved');
}

/** "3 days", "5 hours", "12 minutes": how long a question has waited, for the queue. */
export function waitedFor(since: Date, now: Date): string {
	const minutes = Math.max(0, Math.floor((now.getTime() - since.getTime()) / 60_000));
	if (minutes < 60) return minutes === 1 ? '1 minute' : `${minutes} minutes`;
	const hours = Math.floor(minutes / 60);
	if (hours < 48) return hours === 1 ? '1 hour' : `${hours} hours`;
	return `${Math.floor(hours / 24)} days`;
}

/** A plant's age in whole weeks on a day: its age at planting plus the weeks since. */
export function plantAgeWeeks(plantedOn: string | null, ageAtPlantingWeeks: number | null, today: string): number | null {
	if (!plantedOn || ageAtPlantingWeeks === null) return null;
	const days = (Date.parse(`${today}T00:00:00Z`) - Date.parse(`${plantedOn}T00:00:00Z`)) / 86_400_000;
	return ageAtPlantingWeeks + Math.max(0, Math.floor(days / 7));
}

/** A draft guide's summary from a question: its first sentence, cut to fit and ending in a full stop. */
export function summaryFrom(text: string, max = 240): string {
	const first = (text.match(/^.*?[.!?](?=\s|$)/)?.[0] ?? text).trim();
	const cut = first.length > max - 1 ? first.slice(0, max - 2).replace(/\s+\S*$/, '') + '…' : first;
	return /[.!?…]$/.test(cut) ? cut : `${cut}.`;
}
