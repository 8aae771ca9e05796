import { ConnectionError, DatabaseError } from 'sequelize';

/** Driver codes that mean "the connection to the database went away", not "this statement is wrong". */
const LOST_CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_CONNECTION_TIMEOUT',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_SOCKET_TIMEOUT',
  'ER_SERVER_SHUTDOWN', // 1053: the server is stopping
  'ER_CONNECTION_KILLED', // 1927
  'ER_UNKNOWN_COM_ERROR', // 1047: a Galera node outside the primary component ("WSREP has not yet prepared node")
]);

/** MariaDB error numbers with the same meaning (when the driver gives no code). */
const LOST_CONNECTION_ERRNOS = new Set([1047, 1053, 1927, 2002, 2003, 2006, 2013]);

/**
 * True when `error` says the database cannot be reached (refused, dropped, shutting down,
 * a pool that cannot get a connection, a Galera node without quorum) — a fault of the
 * environment that a retry later may cure — rather than a problem with the request.
 * The error filter answers these with 503; the health check uses the same rule.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true; // refused, host unreachable, acquire time-out, access denied at connect…
  if (error instanceof DatabaseError) return isLostConnection(error.parent ?? error.original);
  // A driver error that reached us without Sequelize (e.g. a raw pool): only the driver's own errors count,
  // so an object-store or mail-server refusal (also ECONNREFUSED) is never taken for the database.
  return (error as { name?: unknown } | null)?.name === 'SqlError' && isLostConnection(error);
}

function isLostConnection(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false;
  const e = error as { code?: unknown; errno?: unknown; fatal?: unknown; name?: unknown };
  if (typeof e.code === 'string' && LOST_CONNECTION_CODES.has(e.code)) return true;
  if (typeof e.errno === 'number' && LOST_CONNECTION_ERRNOS.has(e.errno)) return true;
  // The mariadb driver marks errors after which the connection is unusable as fatal.
  return e.fatal === true && e.name === 'SqlError';
}

/**
 * True when the database refused a transaction because of a conflicting one and rolled it
 * back whole: an InnoDB deadlock, or on Galera a write set that lost certification to a
 * change made on another node at the same moment (reported as a deadlock, 1213). Nothing of
 * the request was saved; the same request a moment later normally goes through.
 */
export function isTransactionConflict(error: unknown): boolean {
  const driver = error instanceof DatabaseError ? (error.parent ?? error.original) : error;
  const e = driver as { code?: unknown; errno?: unknown } | null;
  return e?.code === 'ER_LOCK_DEADLOCK' || e?.errno === 1213;
}

/**
 * True for a bare network error (a Node socket's `syscall` with a reset, broken pipe, refusal
 * or time-out) that reached the error filter unwrapped: the driver lost its socket between
 * Sequelize's handling and ours. Nothing about the request was wrong; a retry may work.
 */
export function isDroppedConnection(error: unknown): boolean {
  const e = error as { code?: unknown; syscall?: unknown } | null;
  return typeof e?.syscall === 'string' && typeof e.code === 'string' && ['ECONNRESET', 'EPIPE', 'ECONNREFUSED', 'ETIMEDOUT'].includes(e.code);
}
