import type { z } from 'zod';
import { CsrfCarrierShape, ErrorBodyShape } from './response-shapes.gen';
import { checkShape, type Shape } from './shape';

type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface ApiErrorInit {
  status: number;
  code: string;
  message: string;
  fields?: Record<string, string>;
  requestId?: string;
}

/** Every failed API call throws one of these; callers switch on `code`, never on `message`. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;
  readonly requestId?: string;

  constructor(init: ApiErrorInit) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.fields = init.fields;
    this.requestId = init.requestId;
  }
}

/** True when the value is an ApiError, optionally with the given HTTP status. */
export function isApiError(value: unknown, status?: number): value is ApiError {
  return value instanceof ApiError && (status === undefined || value.status === status);
}

export interface ApiFetchOptions<T> {
  method?: HttpMethod;
  /** Sent as JSON, except a FormData, which goes as multipart (the browser writes its boundary). */
  body?: unknown;
  /**
   * Parses the success body: a shared zod schema, or on the first page's fetchers its generated shape (the same
   * check without zod, `src/lib/api/response-shapes.gen.ts`). Leave it out for endpoints that answer 204 or whose
   * body is not needed.
   */
  schema?: z.ZodType<T> | Shape<T>;
  signal?: AbortSignal;
  /** Sent as `Idempotency-Key`: the server answers a retry with the same key with its first answer. */
  idempotencyKey?: string;
}

const SESSION_PATH = '/api/session';

/** Checks a body with a zod schema or a generated shape; both answer zod's `{ success, data }`. */
function check<T>(schema: z.ZodType<T> | Shape<T>, value: unknown): { success: true; data: T } | { success: false } {
  return 'safeParse' in schema ? schema.safeParse(value) : checkShape(schema, value);
}

// The token is per browser session; keeping it in module state means one GET serves every later write.
let csrfToken: string | null = null;
let pendingToken: Promise<string> | null = null;

function rememberCsrfToken(data: unknown): void {
  const carrier = checkShape(CsrfCarrierShape, data);
  if (carrier.success) csrfToken = carrier.data.csrfToken;
}

async function loadCsrfToken(): Promise<string> {
  // Several writes can start at once; they share one session request.
  pendingToken ??= apiFetch(SESSION_PATH, { schema: CsrfCarrierShape })
    .then((info) => info.csrfToken)
    .finally(() => {
      pendingToken = null;
    });
  return pendingToken;
}

const fallbackCodes: Record<number, string> = {
  400: 'validation_failed',
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not_found',
  409: 'conflict',
  410: 'gone',
  429: 'rate_limited',
};

async function readError(response: Response): Promise<ApiError> {
  const headerRequestId = response.headers.get('X-Request-Id') ?? undefined;
  const json: unknown = await response.json().catch(() => undefined);
  const parsed = checkShape(ErrorBodyShape, json);
  if (parsed.success) {
    const { code, message, fields, requestId } = parsed.data.error;
    return new ApiError({ status: response.status, code, message, fields, requestId: requestId ?? headerRequestId });
  }
  // A proxy or crash page instead of our JSON: keep the status, say something useful.
  return new ApiError({
    status: response.status,
    code: fallbackCodes[response.status] ?? 'internal',
    message:
      response.status >= 500
        ? `Tillwell is having trouble right now (error ${response.status}). Try again in a moment.`
        : `That didn't work (error ${response.status}). Try again.`,
    requestId: headerRequestId,
  });
}

async function send(path: string, method: HttpMethod, body: unknown, signal?: AbortSignal, idempotencyKey?: string): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (idempotencyKey) headers['Idempotency-Key'] = idempotencyKey;
  const payload = body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body);
  // A FormData needs the browser's own multipart Content-Type, boundary included.
  if (typeof payload === 'string') headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken ?? (await loadCsrfToken());
  try {
    return await fetch(path, {
      method,
      headers,
      body: payload,
      credentials: 'same-origin',
      signal,
    });
  } catch (error) {
    // Aborts are TanStack Query cancelling on purpose; let them through untouched.
    if (signal?.aborted) throw error;
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: "Can't reach Tillwell. Check your connection and try again.",
    });
  }
}

/**
 * Calls the Tillwell API: JSON (or FormData) in, JSON out, CSRF header on every write, zod-checked success bodies,
 * and an ApiError for every failure. Any response carrying `csrfToken` refreshes the cached token.
 */
export async function apiFetch<T = undefined>(path: string, options: ApiFetchOptions<T> = {}): Promise<T> {
  const { method = 'GET', body, schema, signal, idempotencyKey } = options;
  let response = await send(path, method, body, signal, idempotencyKey);

  if (!response.ok) {
    let error = await readError(response);
    if (error.status === 403 && error.code === 'csrf_failed' && method !== 'GET') {
      // The session may have rotated since the token was cached: fetch a fresh one and try once more.
      csrfToken = null;
      await loadCsrfToken();
      response = await send(path, method, body, signal, idempotencyKey);
      if (!response.ok) error = await readError(response);
    }
    if (!response.ok) throw error;
  }

  if (response.status === 204 || !schema) return undefined as T;

  const json: unknown = await response.json().catch(() => undefined);
  const parsed = check(schema, json);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      code: 'invalid_response',
      message: 'Tillwell sent an answer this page could not read. Reload the page and try again.',
      requestId: response.headers.get('X-Request-Id') ?? undefined,
    });
  }
  rememberCsrfToken(parsed.data);
  return parsed.data;
}
