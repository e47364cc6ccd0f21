// People and brands for integration tests, created through the public API like a real studio would.
import { Client, signUpFresh } from '../support/client';
import type { BrandRole } from '../../src/lib/auth/roles';

export const CALLERS = ['anonymous', 'owner', 'editor', 'reviewer', 'partner', 'viewer', 'outsider'] as const;
export type CallerName = (typeof CALLERS)[number];

export interface Cast {
  clients: Record<CallerName, Client>;
  emails: Record<Exclude<CallerName, 'anonymous'>, string>;
  /** An extra person whose membership the member routes may change or remove. */
  target: { email: string };
}

/** One signed-in person per role, an outsider with a studio of their own, and an anonymous client. */
export async function makeCast(): Promise<Cast> {
  const names = ['owner', 'editor', 'reviewer', 'partner', 'viewer', 'outsider'] as const;
  const people = await Promise.all(names.map((n) => signUpFresh(n)));
  const target = await signUpFresh('target');
  const clients = { anonymous: new Client() } as Record<CallerName, Client>;
  const emails = {} as Cast['emails'];
  names.forEach((n, i) => {
    clients[n] = people[i].client;
    emails[n] = people[i].email;
  });
  // The outsider runs a studio of their own, so they are signed in and busy, just not on our brand.
  await clients.outsider.post('/api/brands', { name: 'Outsider Works' });
  return { clients, emails, target: { email: target.email } };
}

/** A brand owned by the cast's owner with every other role filled; returns its id and the target's member id. */
export async function makeBrand(cast: Cast, name = 'Fixture Brand'): Promise<{ brandId: string; targetMemberId: string }> {
  const owner = cast.clients.owner;
  const created = await owner.post('/api/brands', { name });
  if (created.status !== 201) throw new Error(`brand create answered ${created.status}`);
  const brandId: string = created.body.brand.id;
  const roles: [string, BrandRole][] = [
    [cast.emails.editor, 'editor'],
    [cast.emails.reviewer, 'reviewer'],
    [cast.emails.partner, 'partner'],
    [cast.emails.viewer, 'viewer'],
    [cast.target.email, 'viewer'],
  ];
  let targetMemberId = '';
  for (const [email, role] of roles) {
    const r = await owner.post(`/api/brands/${brandId}/members`, { email, role });
    if (r.status !== 201) throw new Error(`member add answered ${r.status}: ${JSON.stringify(r.body)}`);
    if (email === cast.target.email) targetMemberId = r.body.member.id;
  }
  return { brandId, targetMemberId };
}
