import 'server-only';

/** A session ends after two weeks without use (a field trip with no signal fits inside). */
export const SESSION_MAX_AGE_S = 14 * 24 * 60 * 60;
/** A session used more than a day after its token was issued gets a fresh token: it slides. */
export const SESSION_RENEW_AFTER_S = 24 * 60 * 60;
