export { lucia, ABSOLUTE_SESSION_LIFETIME_MS } from './lucia';
export { hashPassword, verifyPassword, burnPasswordCheck, ARGON2_OPTIONS } from './password';
export { newToken, hashToken } from './tokens';
export { consume, forgive, clearSignInFailures, keys as limitKeys, LIMITS, SIGN_IN_LIMITS } from './rate-limit';
export { requireUser, STAFF_ROLES, type AuthUser } from './guard';
export { validateSessionCookie, startSession, endSession, endAllSessions } from './session';
