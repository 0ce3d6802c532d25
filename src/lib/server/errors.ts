/** A refusal the user can act on: names the field and the reason; routes turn it into a 4xx. */
export class UserFacingError extends Error {
	constructor(
		public field: string,
		message: string,
		public status: 400 | 403 | 404 | 409 | 410 | 429 | 503 = 400
	) {
		super(message);
	}
}
