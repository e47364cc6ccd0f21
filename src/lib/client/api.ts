// The one fetch helper on the client: JSON (or a multipart form) in, JSON out, our error shape turned into a readable Error.
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

const OFFLINE = 'Plumbline could not be reached. Check your connection and try again.';
const offline = () => new ApiClientError(0, 'offline', OFFLINE);

/** The parsed body of an answer, or undefined when it is empty or not JSON. */
function parseBody(text: string): unknown {
  try {
    return text ? JSON.parse(text) : undefined;
  } catch {
    return undefined; // Not JSON: the caller falls back to a generic message.
  }
}

/** The error for a failed answer, in the server's words when it sent our error shape. */
const failure = (status: number, body: unknown): ApiClientError => ApiClientError.from(status, body);

/** Call our API; resolves to the parsed JSON body or throws ApiClientError with the server's words. A FormData body goes as multipart. */
export async function api<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const multipart = init.body instanceof FormData;
  let response: Response;
  try {
    response = await fetch(path, {
      method: init.method ?? 'GET',
      headers: init.body === undefined || multipart ? {} : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : multipart ? (init.body as FormData) : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    throw offline();
  }
  if (response.status === 204) return undefined as T;
  const body = parseBody(await response.text());
  if (!response.ok) throw failure(response.status, body);
  return body as T;
}

/** POST a multipart form and report the fraction sent (fetch cannot report upload progress); answers like api(). */
export function apiUpload<T>(path: string, form: FormData, onProgress: (fraction: number) => void = () => {}): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(offline());
    xhr.onload = () => {
      const body = parseBody(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as T);
      else reject(failure(xhr.status, body));
    };
    xhr.send(form);
  });
}
