export { lucia, ABSOLUTE_SESSION_LIFETIME_MS, SESSION_COOKIE } from './lucia';
export { hashPassword, verifyPassword, burnPasswordCheck, ARGON2_OPTIONS } from './password';
export { newToken, hashToken } from './tokens';
export {
	consume,
	consumeAll,
	release,
	clearSignInFailures,
	recentSignInFailures,
	recordSignInFailure,
	signInDelayMs,
	keys as limitKeys,
	LIMITS
} from './rate-limit';
export { requireUser, refusalFor, STAFF_ROLES, type AuthUser } from './guard';
export { validateSessionCookie, startSession, endSession, endAllSessions, endOtherSessions } from './session';
