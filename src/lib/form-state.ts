import type { SubmitFunction } from '@sveltejs/kit';

type ActionResult = Record<string, unknown> | null | undefined;

/** Field errors of a failed action, keyed by field name ("form" for the whole form). */
export function errorsOf(form: ActionResult): Record<string, string> {
	return (form && 'errors' in form ? form.errors : {}) as Record<string, string>;
}

/** The values a failed action sent back, so the form keeps what was typed. */
export function valuesOf(form: ActionResult): Record<string, string> {
	return (form && 'values' in form ? form.values : {}) as Record<string, string>;
}

/** Progressive enhancement that reports when a submission is under way, for a busy button. */
export function busyWhileSubmitting(setBusy: (busy: boolean) => void): SubmitFunction {
	return () => {
		setBusy(true);
		return async ({ update }) => {
			await update();
			setBusy(false);
		};
	};
}
