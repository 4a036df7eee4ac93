export {
  createConsoleSessions,
  toConsoleUser,
  SESSION_COOKIE,
  SESSION_IDLE_MS,
  SESSION_ABSOLUTE_MS,
  type ConsoleSessions,
  type ConsoleUser,
} from './console-sessions';
export { consoleRequestGuard, CONSOLE_HEADER, CONSOLE_HEADER_VALUE } from './console-request-guard';
export {
  createSignInThrottles,
  DEFAULT_THROTTLE_LIMITS,
  GrowingDelayThrottle,
  type ThrottleLimits,
} from './sign-in-throttle';
export { normalizeEmail } from './credentials';
export { recordSignedIn, recordSignedOut, recordSignInFailed } from './sign-in-audit';
