import pino, { type DestinationStream, type Logger } from 'pino';
import type { Request } from 'express';

/**
 * Security event names from the OWASP Application Logging Vocabulary Cheat Sheet
 * (cheatsheetseries.owasp.org/cheatsheets/Logging_Vocabulary_Cheat_Sheet.html), so that monitoring
 * can key on them; plus `http_request` (one line per answered request) and `server_error`.
 */
export type LogEvent =
  | 'authn_login_success'
  | 'authn_login_fail'
  | 'authn_token_reuse'
  | 'authz_fail'
  | 'authz_admin'
  | 'excess_rate_limit_exceeded'
  | 'upload_validation'
  | 'input_validation_fail'
  | 'session_created'
  | 'session_expired'
  | 'sys_startup'
  | 'sys_shutdown'
  | 'http_request'
  | 'server_error';

/** The level each event is logged at (the vocabulary's suggested levels, WARN for refusals). */
const LEVELS: Record<LogEvent, 'info' | 'warn' | 'error'> = {
  authn_login_success: 'info',
  authn_login_fail: 'warn',
  authn_token_reuse: 'warn',
  authz_fail: 'warn',
  authz_admin: 'info',
  excess_rate_limit_exceeded: 'warn',
  upload_validation: 'warn',
  input_validation_fail: 'info',
  session_created: 'info',
  session_expired: 'info',
  sys_startup: 'info',
  sys_shutdown: 'info',
  http_request: 'info',
  server_error: 'error',
};

export type LogLevel = 'silent' | 'error' | 'warn' | 'info' | 'debug';

// A last line of defence behind the redaction paths: whatever the field, an e-mail address or
// a Bearer credential never reaches the log stream.
const EMAIL = /[A-Z0-9._%+-]+@[A-Z0-9-]+(?:\.[A-Z0-9-]+)*\.[A-Z]{2,}/gi;
const BEARER = /\b(bearer\s+)[A-Za-z0-9._~+/-]+=*/gi;
/** Edgeledger's API tokens start with elt_ (server/commands/create-token.ts). */
const API_TOKEN = /\belt_[A-Za-z0-9_-]{4,}/g;

/** Removes e-mail addresses, Bearer credentials and API tokens from a string. */
export function scrub(text: string): string {
  return text.replace(EMAIL, '[email]').replace(BEARER, '$1[token]').replace(API_TOKEN, 'elt_[token]');
}

/** Fields never written, wherever they appear one level down (request headers, bodies, users). */
const REDACT = [
  'cookie',
  'authorization',
  'email',
  'token',
  'password',
  'secret',
  'csrfToken',
  '*.cookie',
  '*.authorization',
  '*["set-cookie"]',
  '*["x-csrf-token"]',
  '*.email',
  '*.token',
  '*.password',
  '*.secret',
  '*.csrfToken',
  '*.accessToken',
  '*.refreshToken',
];

/**
 * An error as logged: its class, message and stack, never Sequelize's `sql` or bound
 * `parameters` (which may hold personal data).
 */
function errorForLog(err: unknown): Record<string, unknown> {
  if (!(err instanceof Error)) return { message: scrub(String(err)) };
  const cause = (err as { original?: unknown }).original;
  return {
    type: err.name,
    message: scrub(err.message),
    stack: err.stack ? scrub(err.stack) : undefined,
    ...(cause instanceof Error ? { cause: `${cause.name}: ${scrub(cause.message)}` } : {}),
  };
}

function build(level: LogLevel, destination?: DestinationStream): Logger {
  return pino(
    {
      level,
      base: { app: 'edgeledger', pid: process.pid },
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: { paths: REDACT, censor: '[redacted]' },
      serializers: { err: errorForLog },
      hooks: { streamWrite: scrub },
    },
    // Asynchronous: lines written while one write is under way go out together, instead of one
    // blocking write per request; pino flushes what is left when the process exits.
    destination ?? pino.destination({ dest: 1, sync: false }),
  );
}

function initialLevel(): LogLevel {
  const given = process.env.LOG_LEVEL as LogLevel | undefined;
  if (given && ['silent', 'error', 'warn', 'info', 'debug'].includes(given)) return given;
  return process.env.NODE_ENV === 'test' || process.env.VITEST ? 'silent' : 'info';
}

let current = build(initialLevel());

/** The process's logger (pino, one JSON object per line on stdout). */
export function logger(): Logger {
  return current;
}

/**
 * Replaces the logger: its level (from LOG_LEVEL) and, for tests that read log lines, its
 * destination stream.
 */
export function configureLogging(options: { level: LogLevel; destination?: DestinationStream }): void {
  current = build(options.level, options.destination);
}

/** Who and what a request is, for a log line: never its cookies, tokens or query string. */
export function requestFields(req: Request): Record<string, unknown> {
  const user = req.user as { id?: number } | undefined;
  return {
    method: req.method,
    path: (req.originalUrl ?? req.url).split('?')[0],
    ip: req.ip,
    ...(user?.id !== undefined ? { userId: user.id } : {}),
  };
}

/**
 * Logs one security event with the vocabulary's name as `event` and the request's method,
 * path, address and account id. `detail` must not hold personal data or secrets (they would be
 * redacted, but should not be passed in the first place).
 */
export function logEvent(event: LogEvent, req: Request | null, detail: Record<string, unknown> = {}): void {
  const line = { event, ...(req ? requestFields(req) : {}), ...detail };
  current[LEVELS[event]](line, event);
}

/** Logs an unexpected error with its stack (for operators; clients get a plain sentence). */
export function logError(err: unknown, req: Request | null): void {
  current.error({ event: 'server_error', ...(req ? requestFields(req) : {}), err }, 'server_error');
}
