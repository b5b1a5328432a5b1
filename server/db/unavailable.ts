/**
 * Whether an error means PostgreSQL cannot be reached right now (stopped, restarting, the
 * network to it down) rather than a fault in the request. Such requests answer 503 and the
 * pools reconnect by themselves once the database is back.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: unknown; name?: unknown; message?: unknown; errors?: unknown };
  const code = typeof e.code === 'string' ? e.code : '';
  // Socket-level failures reaching the server.
  if (['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN'].includes(code)) return true;
  // SQLSTATE class 08 (connection exception) and 57P01–57P03 (shutdown, crash, cannot connect now):
  // PostgreSQL's documented error codes, Appendix A of its manual.
  if (/^08[0-9A-Z]{3}$/.test(code) || ['57P01', '57P02', '57P03'].includes(code)) return true;
  const message = typeof e.message === 'string' ? e.message : '';
  if (e.name === 'KnexTimeoutError' || /Connection terminated|Client has encountered a connection error|terminating connection/i.test(message)) {
    return true;
  }
  // Node wraps several failed connection attempts (IPv4 and IPv6) in an AggregateError.
  if (Array.isArray(e.errors)) return e.errors.some(isDatabaseUnavailable);
  return false;
}
