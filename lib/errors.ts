// One error type for everything a handler refuses on purpose; anything else is a 500 that is logged, never echoed.
const ERROR_STATUS = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  locked: 423,
  rate_limited: 429,
  unavailable: 503,
} as const;

type ErrorCode = keyof typeof ERROR_STATUS;

export class AppError extends Error {
  constructor(
    public readonly code: ErrorCode,
    message: string,
    public readonly fields?: Record<string, string[]>,
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...this.extra } };
  }
}

// Seconds a client should wait before retrying while the database cannot be reached.
export const DATABASE_RETRY_AFTER_SECONDS = 5;

// Node's socket errors and PostgreSQL's "cannot serve you now" states (SQLSTATE class 08 connection
// exceptions; 57P01–57P03 shutdown and start-up; 53300 too many connections).
const NETWORK_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "ENOTFOUND", "EHOSTUNREACH", "ENETUNREACH", "EAI_AGAIN"]);
const PG_UNAVAILABLE = /^(08...|57P0[123]|53300)$/;
const POOL_MESSAGES = [
  "Connection terminated",
  "timeout exceeded when trying to connect",
  "Client has encountered a connection error",
  "Cannot use a pool after calling end",
  "the database system is starting up",
  "the database system is shutting down",
];

/**
 * True when an error (or anything it wraps: drizzle puts the driver's error in `cause`, a refused connection
 * to a host with several addresses is an AggregateError) says the database could not be reached, as opposed
 * to a query the database refused.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  const seen = new Set<unknown>();
  const queue: unknown[] = [error];
  while (queue.length) {
    const e = queue.shift();
    if (!e || typeof e !== "object" || seen.has(e)) continue;
    seen.add(e);
    const { code, message, cause, errors } = e as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
    if (typeof code === "string" && (NETWORK_CODES.has(code) || PG_UNAVAILABLE.test(code))) return true;
    if (typeof message === "string" && POOL_MESSAGES.some((m) => message.includes(m))) return true;
    queue.push(cause);
    if (Array.isArray(errors)) queue.push(...errors);
  }
  return false;
}

/** The SQLSTATE and constraint of a database refusal, thrown bare by pg or wrapped by Drizzle (`cause`). */
export function databaseRefusal(error: unknown): { code?: string; constraint?: string } {
  const e = error as { code?: unknown; constraint?: unknown; cause?: { code?: unknown; constraint?: unknown } };
  const text = (v: unknown) => (typeof v === "string" ? v : undefined);
  return { code: text(e?.code) ?? text(e?.cause?.code), constraint: text(e?.constraint) ?? text(e?.cause?.constraint) };
}

/**
 * Runs a write whose last word belongs to the database rules: a refusal that `explain` recognises becomes that
 * AppError (a 409 with a reason), never a 500. AppErrors thrown by the write itself pass through unchanged.
 */
export async function withDatabaseRefusals<T>(run: () => Promise<T>, explain: (refusal: { code?: string; constraint?: string }) => AppError | undefined): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof AppError) throw error;
    throw explain(databaseRefusal(error)) ?? error;
  }
}
