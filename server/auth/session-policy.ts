// How long a session lives. OWASP Session Management Cheat Sheet: an idle timeout and an absolute
// timeout, both enforced on the server. A crew signs in on a phone before an event weekend, so
// the idle window covers a week off; the absolute limit forces a fresh sign-in monthly.
const dayMs = 24 * 60 * 60 * 1000
export const sessionIdleMs = 7 * dayMs
export const sessionAbsoluteMs = 30 * dayMs
// Writing last-seen on every request would turn reads into writes; a minute's slack is harmless.
export const sessionTouchIntervalMs = 60 * 1000
