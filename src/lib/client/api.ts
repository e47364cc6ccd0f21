// The one fetch helper on the client: JSON in and out, our error shape turned into a readable Error.

export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly body?: unknown,
  ) {
    super(message);
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
  if (!response.ok) {
    const err = (body as { error?: { code?: string; message?: string; details?: unknown }; message?: string; code?: string }) ?? {};
    const message = err.error?.message ?? err.message ?? `The server answered ${response.status}.`;
    throw new ApiClientError(response.status, err.error?.code ?? err.code ?? 'http_error', message, err.error?.details, body);
  }
  return body as T;
}
