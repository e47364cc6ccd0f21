// A small HTTP client for integration tests: one cookie jar per person, JSON helpers, our origin header.
import { randomUUID } from 'node:crypto';
import { inject } from 'vitest';
import { DEMO_PASSWORD } from '../../db/seeders/demo';

export const baseUrl = () => inject('baseUrl');

export interface Reply<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export class Client {
  private cookies = new Map<string, string>();

  /** `base`: another server than the suite's (a test that starts its own with other settings). */
  constructor(private readonly base?: string) {}

  private get root(): string {
    return this.base ?? baseUrl();
  }

  /** Send a request; `body` as an object is JSON, as a string is sent raw. */
  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const h: Record<string, string> = { origin: this.root, ...headers };
    if (this.cookies.size) h.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    let payload: string | undefined;
    if (body !== undefined) {
      payload = typeof body === 'string' ? body : JSON.stringify(body);
      h['content-type'] ??= 'application/json';
    }
    const res = await fetch(this.root + path, { method, headers: h, body: payload, redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      const name = pair.slice(0, i);
      const value = pair.slice(i + 1);
      if (value === '' || /max-age=0/i.test(c)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // Not JSON: keep the text.
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** Upload one file as multipart/form-data (field "file") with extra text fields. */
  async upload<T = any>(path: string, filename: string, content: string | Uint8Array, type: string, fields: Record<string, string> = {}): Promise<Reply<T>> {
    const form = new FormData();
    form.set('file', new Blob([typeof content === 'string' ? content : new Uint8Array(content)], { type }), filename);
    for (const [k, v] of Object.entries(fields)) form.set(k, v);
    const h: Record<string, string> = { origin: this.root };
    if (this.cookies.size) h.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    const res = await fetch(this.root + path, { method: 'POST', headers: h, body: form });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // Not JSON: keep the text.
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  get = <T = any>(path: string) => this.request<T>('GET', path);
  post = <T = any>(path: string, body?: unknown) => this.request<T>('POST', path, body ?? {});
  patch = <T = any>(path: string, body?: unknown) => this.request<T>('PATCH', path, body ?? {});
  delete = <T = any>(path: string) => this.request<T>('DELETE', path);

  /** The Cookie header this client would send. */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  get signedIn(): boolean {
    return [...this.cookies.keys()].some((k) => k.includes('session_token'));
  }
}

/** Sign in an existing person; throws when the server says no. */
export async function signIn(email: string, password = DEMO_PASSWORD): Promise<Client> {
  const client = new Client();
  const r = await client.post('/api/auth/sign-in/email', { email, password });
  if (r.status !== 200) throw new Error(`sign-in of ${email} answered ${r.status}: ${JSON.stringify(r.body)}`);
  return client;
}

/** Sign up a fresh person with a unique address. */
export async function signUpFresh(label = 'person'): Promise<{ client: Client; email: string; id: string }> {
  const client = new Client();
  const email = `${label}-${randomUUID().slice(0, 8)}@test.example`;
  const r = await client.post('/api/auth/sign-up/email', { email, password: 'correct-horse-battery', name: `Test ${label}` });
  if (r.status !== 200) throw new Error(`sign-up answered ${r.status}: ${JSON.stringify(r.body)}`);
  return { client, email, id: r.body.user.id };
}
