// A small HTTP client for integration tests: one cookie jar per person, JSON helpers, our origin header.
import { randomUUID } from 'node:crypto';
import { inject } from 'vitest';
import { DEMO_PASSWORD } from '@db/seeders/demo';
import { lastMailTo, linkIn, mailTo } from './mailbox';

export const baseUrl = () => inject('baseUrl');

export interface Reply<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export class Client {
  /** `base`: another server than the suite's (a test that starts its own with other settings). */
  constructor(
    private readonly base?: string,
    private readonly cookies = new Map<string, string>(),
    private readonly origin?: string,
  ) {}

  private get root(): string {
    return this.base ?? baseUrl();
  }

  /**
   * The same person (one cookie jar) reaching the site through another process at `base`, as a load balancer in front
   * of several would send them; the Origin stays the site's.
   */
  via(base: string): Client {
    return new Client(base, this.cookies, this.origin ?? this.root);
  }

  /** Send a request; `body` as an object is JSON, as a string is sent raw. */
  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const h: Record<string, string> = { origin: this.origin ?? this.root, ...headers };
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
    const h: Record<string, string> = { origin: this.origin ?? this.root };
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

/** The address link from the newest mail to `email` (sent at sign-up or on request), as a path on the site. */
export function verificationPath(email: string): string {
  const mail = mailTo(email).find((m) => m.text.includes('/api/auth/verify-email?token='));
  if (!mail) throw new Error(`no address link was mailed to ${email}`);
  const url = new URL(/https?:\/\/\S+\/api\/auth\/verify-email\?\S+/.exec(mail.text)![0]);
  return url.pathname + url.search;
}

/** Prove `email` as its owner would: open the link from the captured mail with this person's session. */
export async function verifyByMail(client: Client, email: string): Promise<void> {
  const r = await client.get(verificationPath(email));
  if (r.status !== 302) throw new Error(`the address link answered ${r.status}: ${JSON.stringify(r.body)}`);
}

/** Sign up a person with `email` without proving the address (for tests of what an unproven account may not do). */
export async function signUpUnverified(email: string, name = 'Unproven Person'): Promise<{ client: Client; email: string; id: string }> {
  const client = new Client();
  const r = await client.post('/api/auth/sign-up/email', { email, password: 'correct-horse-battery', name });
  if (r.status !== 200) throw new Error(`sign-up answered ${r.status}: ${JSON.stringify(r.body)}`);
  return { client, email, id: r.body.user.id };
}

/** Sign up a fresh person with a unique address and prove it through the mailed link. */
export async function signUpFresh(label = 'person'): Promise<{ client: Client; email: string; id: string }> {
  const person = await signUpUnverified(`${label}-${randomUUID().slice(0, 8)}@test.example`, `Test ${label}`);
  await verifyByMail(person.client, person.email);
  return person;
}

/** Invite `person` to a brand and accept as them (the token read from their mail); the new membership's id. */
export async function joinBrand(owner: Client, brandId: string, person: { client: Client; email: string }, role: string): Promise<string> {
  const invited = await owner.post(`/api/brands/${brandId}/members`, { email: person.email, role });
  if (invited.status !== 201) throw new Error(`invitation answered ${invited.status}: ${JSON.stringify(invited.body)}`);
  const { token } = linkIn(lastMailTo(person.email), '/invite/');
  const joined = await person.client.post(`/api/invitations/${token}/accept`, {});
  if (joined.status !== 200) throw new Error(`accepting answered ${joined.status}: ${JSON.stringify(joined.body)}`);
  return joined.body.joined.memberId;
}
