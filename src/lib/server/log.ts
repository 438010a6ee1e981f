import { AsyncLocalStorage } from 'node:async_hooks';
import { pino, type DestinationStream, type Logger, type LoggerOptions } from 'pino';
import { config } from './config';

/**
 * The server's log: JSON lines on stdout (pino), at LOG_LEVEL and above. During a request,
 * `currentLog()` is a child that carries the request's id, so every line of one request can be found.
 */

/** Whatever a line might carry that must never reach a log: session cookies, credentials, passwords. */
const REDACTED_PATHS = [
  'headers.cookie',
  'headers.authorization',
  'headers["set-cookie"]',
  'req.headers.cookie',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  'password',
  'newPassword',
  'currentPassword',
  'passwordHash',
  '*.password',
  '*.newPassword',
  '*.currentPassword',
  '*.passwordHash',
];

/** Listeners told of every line at level error or above (the test setup fails a test that writes one unexpectedly). */
const errorLineListeners = new Set<(args: unknown[]) => void>();

/** pino's number for the error level. */
const ERROR_LEVEL = 50;

/** A logger with the server's settings; `destination` is stdout unless a test passes its own. */
export function createLogger(destination?: DestinationStream): Logger {
  const options: LoggerOptions = {
    level: config.logLevel,
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
    hooks: {
      logMethod(args, method, level) {
        if (level >= ERROR_LEVEL) for (const listener of errorLineListeners) listener(args);
        return method.apply(this, args);
      },
    },
  };
  return destination ? pino(options, destination) : pino(options);
}

export const logger: Logger = createLogger();

/** Calls `listener` with the arguments of every error-level line from now on; returns a function that stops it. */
export function onErrorLine(listener: (args: unknown[]) => void): () => void {
  errorLineListeners.add(listener);
  return () => errorLineListeners.delete(listener);
}

const requestLogs = new AsyncLocalStorage<Logger>();

/** Runs one request's work with a log that names its id. */
export function withRequestLog<T>(requestId: string, work: () => T): T {
  return requestLogs.run(logger.child({ requestId }), work);
}

/** The current request's log, or the process log outside a request. */
export function currentLog(): Logger {
  return requestLogs.getStore() ?? logger;
}
