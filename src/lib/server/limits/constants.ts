/** Every limit on a way in, in one place. Windows are in seconds, as rate-limiter-flexible counts them. */

/** How long an emailed sign-in link works; also the window of the link limits below. */
export const SIGN_IN_LINK_LIFETIME_MINUTES = 15;
export const SIGN_IN_LINK_LIFETIME_SECONDS = SIGN_IN_LINK_LIFETIME_MINUTES * 60;

export type LimitRule = { points: number; duration: number };

export type Gate = { allowed: true } | { allowed: false; retryAfterSeconds: number };

const fifteenMinutes = 15 * 60;
const oneHour = 60 * 60;

export const PASSWORD_SIGN_IN_PER_ACCOUNT: LimitRule = { points: 5, duration: fifteenMinutes };
export const PASSWORD_SIGN_IN_PER_ADDRESS: LimitRule = { points: 20, duration: fifteenMinutes };

/** At most this many live links per address and per e-mail at any one time. */
export const SIGN_IN_LINK_PER_EMAIL: LimitRule = { points: 5, duration: SIGN_IN_LINK_LIFETIME_SECONDS };
export const SIGN_IN_LINK_PER_ADDRESS: LimitRule = { points: 20, duration: SIGN_IN_LINK_LIFETIME_SECONDS };

export const SIGN_UP_PER_EMAIL: LimitRule = { points: 3, duration: oneHour };
export const SIGN_UP_PER_ADDRESS: LimitRule = { points: 20, duration: oneHour };

export const PASSWORD_CHANGE_PER_ACCOUNT: LimitRule = { points: 5, duration: fifteenMinutes };
export const PASSWORD_CHANGE_PER_ADDRESS: LimitRule = { points: 20, duration: fifteenMinutes };

/** The public JSON API: generous, it only stops floods. */
export const PUBLIC_API_PER_ADDRESS: LimitRule = { points: 600, duration: 60 };
/** Points of the public API limit a process takes from the shared counter at once (see `leasedLimit`). */
export const PUBLIC_API_LEASE = 10;
