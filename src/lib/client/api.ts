// The one fetch helper on the client: JSON in and out, our error shape turned into a readable Error.
import { readErrorBody } from '@/lib/errors';

export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly body?: unknown,
    /** The server's id for a failure on its side; the message quotes it so a person can pass it on. */
    readonly requestId?: string,
  ) {
    super(requestId ? `${message} (Reference: ${requestId})` : message);
  }

  /** The error an answer of ours (`{error:{code,message,…}}`, parsed or not) stands for. */
  static from(status: number, body: unknown): ApiClientError {
    const e = readErrorBody(status, body);
    return new ApiClientError(status, e.code, e.message, e.details, body, e.requestId);
  }
}

/** Call our API; resolves to the parsed JSON body or throws ApiClientError with the server's words. */
export async function api<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? {} : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiClientError(0, 'offline', 'Plumbline could not be reached. Check your connection and try again.');
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  let body: unknown = undefined;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    // Not JSON: fall through to a generic message.
  }
  if (!response.ok) throw ApiClientError.from(response.status, body);
  return body as T;
}
