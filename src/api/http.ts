import { Notify } from 'quasar';
import type { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/api-error';

/** An error answered by the API, in its `{ error: { code, message, field? } }` shape. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export interface RequestOptions<S extends z.ZodType | undefined> {
  body?: unknown;
  /** Multipart upload instead of JSON. */
  form?: FormData;
  /** Parses the reply; a reply that does not match is an error, never trusted data. */
  schema?: S;
  signal?: AbortSignal;
  /** Do not show a notification for errors (the caller shows them in place). */
  quiet?: boolean;
}

type Reply<S> = S extends z.ZodType ? z.infer<S> : void;

let onUnauthorized: (() => void) | undefined;
/** Called when a request answers 401 (the session ended): the auth boot sends the user to sign in. */
export function setUnauthorizedHandler(handler: () => void): void {
  onUnauthorized = handler;
}

export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE',
  url: string,
  options: RequestOptions<S> = {},
): Promise<Reply<S>> {
  // The server refuses writes without it (or JSON): another site's form cannot send it.
  const headers: Record<string, string> = { Accept: 'application/json', 'X-Requested-With': 'tarnish' };
  let body: BodyInit | undefined;
  if (options.form) body = options.form;
  else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  // A create carries a key of its own, so sending it again after a lost answer cannot store it twice.
  if (method === 'POST') headers['Idempotency-Key'] = crypto.randomUUID();
  let response: Response;
  try {
    response = await sendOnceMore(() => fetch(url, { method, headers, body, credentials: 'same-origin', signal: options.signal }), options.signal);
  } catch (cause) {
    if ((cause as Error).name === 'AbortError') throw cause;
    const err = new ApiError(0, 'network', 'The server could not be reached. Check your connection and try again.');
    if (!options.quiet) notifyApiError(err);
    throw err;
  }
  if (!response.ok) {
    const err = await toApiError(response);
    if (err.status === 401 && onUnauthorized && !url.endsWith('/api/auth/sign-in')) onUnauthorized();
    if (!options.quiet && !err.field) notifyApiError(err);
    throw err;
  }
  if (response.status === 204 || !options.schema) return undefined as Reply<S>;
  const parsed = options.schema.safeParse(await response.json());
  if (!parsed.success) {
    const err = new ApiError(response.status, 'bad_reply', 'The server sent a reply this page does not understand. Reload the page.');
    if (!options.quiet) notifyApiError(err);
    throw err;
  }
  return parsed.data as Reply<S>;
}

/** The longest the client waits, once, before sending a request again that the server asked to retry. */
const MAX_RETRY_WAIT_MS = 5000;

/**
 * Sends a request, and once more when the connection failed or the server answered 503 with
 * Retry-After (the database was briefly away): safe, because writes carry an idempotency key.
 */
async function sendOnceMore(send: () => Promise<Response>, signal?: AbortSignal): Promise<Response> {
  let waitMs: number;
  try {
    const first = await send();
    const retryAfter = Number(first.headers.get('Retry-After'));
    if (first.status !== 503 || !Number.isFinite(retryAfter) || retryAfter <= 0) return first;
    waitMs = Math.min(retryAfter * 1000, MAX_RETRY_WAIT_MS);
  } catch (cause) {
    if ((cause as Error).name === 'AbortError') throw cause;
    waitMs = 1000;
  }
  await new Promise((resolve) => setTimeout(resolve, waitMs));
  if (signal?.aborted) throw new DOMException('Aborted', 'AbortError');
  return send();
}

async function toApiError(response: Response): Promise<ApiError> {
  const text = await response.text();
  try {
    const parsed = apiErrorSchema.safeParse(JSON.parse(text));
    if (parsed.success) {
      const e = parsed.data.error;
      return new ApiError(response.status, e.code, e.message, e.field, e.details);
    }
  } catch {
    // Not JSON: fall through to a plain message.
  }
  return new ApiError(response.status, 'http_' + response.status, `The server answered ${response.status} ${response.statusText}.`);
}

export function notifyApiError(err: unknown): void {
  const message = err instanceof Error ? err.message : 'Something went wrong.';
  Notify.create({ type: 'negative', message, position: 'top', timeout: 6000 });
}

export const api = {
  get: <S extends z.ZodType>(url: string, schema: S, options: Omit<RequestOptions<S>, 'schema'> = {}) =>
    apiRequest('GET', url, { ...options, schema }),
  post: <S extends z.ZodType | undefined = undefined>(url: string, body?: unknown, options: RequestOptions<S> = {}) =>
    apiRequest('POST', url, { ...options, body }),
  put: <S extends z.ZodType | undefined = undefined>(url: string, body?: unknown, options: RequestOptions<S> = {}) =>
    apiRequest('PUT', url, { ...options, body }),
  patch: <S extends z.ZodType | undefined = undefined>(url: string, body?: unknown, options: RequestOptions<S> = {}) =>
    apiRequest('PATCH', url, { ...options, body }),
  delete: <S extends z.ZodType | undefined = undefined>(url: string, options: RequestOptions<S> = {}) =>
    apiRequest('DELETE', url, options),
};
