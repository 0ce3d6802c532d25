// See https://svelte.dev/docs/kit/types#app.d.ts
declare global {
	namespace App {
		interface Locals {
			user: import('lucia').User | null;
			session: import('lucia').Session | null;
			/** Set by a GET form page that re-renders with field errors: the page is answered with 400. */
			invalidInput?: boolean;
		}
		interface Error {
			message: string;
		}
	}
}

export {};
