// Palette routes: prepared by the designer, sent by link (no account), chosen once by the client, then used as the palette.
import { wcagContrast } from 'culori';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn, mailTo } from '../support/mailbox';

const HOSTILE = '<img src=x onerror=alert(1)> & "quotes"';
let designer: Client;
let designerEmail: string;
let brandId: string;
const b = () => `/api/brands/${brandId}/palette-routes`;
let n = 0;
const contact = () => `routes-${Date.now()}-${n++}@client.example`;

const ROUTES = [
  {
    name: HOSTILE,
    rationale: `Deep and quiet.\n${HOSTILE}`,
    colors: [
      { name: 'Ink', value: '#000000', role: 'text' },
      { name: 'Paper', value: '#ffffff', role: 'background' },
      { name: 'Mid grey', value: '#777777', role: 'neutral' },
      { name: 'Cobalt', value: 'oklch(45% 0.15 260)', role: 'primary' },
    ],
  },
  {
    name: 'Hayfield',
    rationale: 'Sunlit and open.',
    colors: [
      { name: 'Straw', value: '#e9c46a', role: 'primary' },
      { name: 'Loam', value: '#264653', role: 'text' },
      { name: 'Linen', value: '#faf6ee', role: 'background' },
    ],
  },
];

/** A set of the two routes, sent to a fresh contact; its link read from the captured mail. */
async function sentSet(title = 'Routes for spring') {
  const made = await designer.post(b(), { title, routes: ROUTES });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  const email = contact();
  const sent = await designer.post(`${b()}/${made.body.set.id}/send`, { contactName: 'Ada Client', contactEmail: email });
  expect(sent.status, JSON.stringify(sent.body)).toBe(200);
  expect(sent.body.mailed).toBe(true);
  const mail = lastMailTo(email);
  return { set: made.body.set, email, mail, link: linkIn(mail, '/palette/') };
}

beforeAll(async () => {
  ({ client: designer, email: designerEmail } = await signUpFresh('router'));
  brandId = (await designer.post('/api/brands', { name: 'Wendle Cider Works' })).body.brand.id;
  for (const [i, c] of [['Pressed apple', '#c9a227', 'primary'], ['Cellar', '#2b2118', 'text'], ['Label paper', '#fbf8f1', 'background']].entries()) {
    const r = await designer.post(`/api/brands/${brandId}/colors`, { name: c[0], value: c[1], role: c[2] });
    expect(r.status, `colour ${i}`).toBe(201);
  }
});
afterAll(closeDb);

describe('preparing routes', () => {
  test('each route carries its colours and, per text/ground pair, the WCAG 2.2 ratio as culori computes it', async () => {
    const r = await designer.post(b(), { title: 'First look', routes: ROUTES });
    expect(r.status).toBe(201);
    const [first, second] = r.body.set.routes;
    // CSS Color 4 oklch() is parsed to sRGB hex once; the route keeps what was typed.
    expect(first.colors[3].value).toBe('oklch(45% 0.15 260)');
    expect(first.colors[3].hex).toMatch(/^#[0-9a-f]{6}$/);
    // Grounds are the colours marked "background": every other colour is checked as text on Paper / Linen.
    expect(first.contrast).toHaveLength(3);
    expect(second.contrast).toHaveLength(2);
    for (const route of [first, second]) {
      const hex = new Map<string, string>(route.colors.map((c: { id: string; hex: string }) => [c.id, c.hex]));
      for (const pair of route.contrast) {
        // Reference library: culori's wcagContrast (WCAG 2.x relative-luminance formula).
        expect(pair.ratio).toBeCloseTo(wcagContrast(hex.get(pair.text)!, hex.get(pair.ground)!), 6);
      }
    }
    const byName = (name: string) => first.contrast.find((p: { text: string }) => first.colors.find((c: { id: string; name: string }) => c.id === p.text).name === name);
    // WCAG 2.2 definition of contrast ratio: black on white is 21:1, which meets SC 1.4.6 (AAA).
    expect(byName('Ink')).toMatchObject({ shown: '21.00', verdict: 'AAA' });
    // #777777 on white is 4.48:1 (from memory, a well-known near miss): below SC 1.4.3's 4.5:1, above 3:1 for large text.
    expect(byName('Mid grey')).toMatchObject({ shown: '4.47', verdict: 'AA large' });
  });

  test('a route needs 2–12 colours, a set 2–4 routes; a name with a control character or bidi override is refused; nothing is saved', async () => {
    const before = (await designer.get(b())).body.sets.length;
    const one = await designer.post(b(), { title: 'Too few', routes: [ROUTES[0]] });
    expect(one.status).toBe(400);
    const tiny = await designer.post(b(), { title: 'Thin', routes: [ROUTES[0], { ...ROUTES[1], colors: ROUTES[1].colors.slice(0, 1) }] });
    expect(tiny.status).toBe(400);
    const bidi = await designer.post(b(), { title: 'Sly', routes: [ROUTES[0], { ...ROUTES[1], name: 'Hay\u202efield' }] });
    expect(bidi.status).toBe(400);
    const colour = await designer.post(b(), { title: 'Odd', routes: [ROUTES[0], { ...ROUTES[1], colors: [{ name: 'X', value: 'not-a-colour' }, ROUTES[1].colors[0]] }] });
    expect(colour.status).toBe(400);
    expect((await designer.get(b())).body.sets.length).toBe(before);
  });
});

describe('the client link', () => {
  test('opens without an account; hostile names are escaped in the page and in the e-mail', async () => {
    const { link, mail } = await sentSet();
    const page = await fetch(link.url);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Routes for spring');
    expect(html).not.toContain('<img src=x');
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    // The e-mail lists the route names: escaped in HTML (OWASP rule 1), as typed in the plain text.
    expect(mail.html).not.toContain('<img src=x');
    expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt; &amp; &quot;quotes&quot;');
    expect(mail.text).toContain(HOSTILE);
    expect((await new Client().get(`/api/palette-routes/${link.token}`)).body.set.routes).toHaveLength(2);
  });

  test('an expired link is refused (410) for reading and answering; a wrong token is 404', async () => {
    const { set, link } = await sentSet('Expiring routes');
    await sql(`UPDATE palette_route_sets SET expires_at = now() - interval '1 minute' WHERE id = $1`, [set.id]);
    expect((await new Client().get(`/api/palette-routes/${link.token}`)).status).toBe(410);
    const answer = await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Ada', choice: set.routes[0].id });
    expect(answer.status).toBe(410);
    expect(answer.body.error.code).toBe('routes_expired');
    expect((await fetch(link.url)).status).toBe(410);
    expect((await new Client().get(`/api/palette-routes/${'C'.repeat(43)}`)).status).toBe(404);
  });

  test('the client chooses once: the decision is recorded, audited and e-mailed to the designer; a second answer is refused (409)', async () => {
    const { set, link } = await sentSet('Choosing routes');
    const empty = await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Ada', choice: null });
    expect(empty.status).toBe(400);
    const r = await new Client().post(`/api/palette-routes/${link.token}/decision`, {
      name: 'Ada Client',
      choice: set.routes[1].id,
      comment: `Warmer, please. ${HOSTILE}`,
      routes: [{ id: set.routes[0].id, comment: 'Too cold for us.' }],
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.set.status).toBe('chosen');
    expect(r.body.set.decision).toMatchObject({ by: 'Ada Client', chosenRouteId: set.routes[1].id });
    expect(r.body.set.routes[0].clientComment).toBe('Too cold for us.');
    const again = await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Someone else', choice: set.routes[0].id });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_decided');
    const [row] = await sql('SELECT status, chosen_route_id, decided_by_name FROM palette_route_sets WHERE id = $1', [set.id]);
    expect(row).toEqual({ status: 'chosen', chosen_route_id: set.routes[1].id, decided_by_name: 'Ada Client' });
    const audits = await sql(`SELECT details FROM audit_events WHERE target_id = $1 AND action = 'paletteRoutes.decide'`, [set.id]);
    expect(audits).toHaveLength(1);
    expect(audits[0].details).toMatchObject({ chosenRoute: 'Hayfield', by: 'Ada Client' });
    const told = mailTo(designerEmail).find((m) => m.subject.includes('Choosing routes'));
    expect(told?.subject).toContain('Hayfield');
    expect(told?.text).toContain('Too cold for us.');
    expect(told?.html).not.toContain('<img src=x');
    expect(told?.html).toContain('&lt;img src=x');
    // The page still opens after the answer and shows it, read-only.
    expect(await (await fetch(link.url)).text()).toContain('You chose');
  });

  test('comments without a choice send the set back; sending again makes a new link and the old one stops working', async () => {
    const { set, link } = await sentSet('Commented routes');
    const r = await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Ada', choice: null, comment: 'Neither yet: try a green.' });
    expect(r.status).toBe(200);
    expect(r.body.set.status).toBe('comments');
    const again = await designer.post(`${b()}/${set.id}/send`, { contactName: 'Ada Client', contactEmail: 'ada-again@client.example' });
    expect(again.status).toBe(200);
    expect((await new Client().get(`/api/palette-routes/${link.token}`)).status).toBe(404);
    expect(linkIn(lastMailTo('ada-again@client.example'), '/palette/').token).not.toBe(link.token);
  });
});

describe('use this route', () => {
  const palette = async () =>
    (await sql('SELECT id, name, hex, role, position FROM brand_colors WHERE brand_id = $1 ORDER BY position', [brandId])) as { id: string; name: string; hex: string; role: string; position: number }[];

  test('refused before the client has chosen (409); the palette is untouched', async () => {
    const { set } = await sentSet('Undecided routes');
    const before = await palette();
    const r = await designer.post(`${b()}/${set.id}/adopt`, {});
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('no_route_chosen');
    expect(await palette()).toEqual(before);
  });

  test('a failure half-way leaves the old palette whole (one transaction)', async () => {
    const { set, link } = await sentSet('Failing routes');
    await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Ada', choice: set.routes[0].id });
    const before = await palette();
    // The brand has three colours and the route four: Ink, Paper and Cobalt take over rows by role, Mid grey is a new
    // row, written after those updates; the database refuses it, so the updates before it must be undone too.
    await sql(`CREATE OR REPLACE FUNCTION refuse_route_colour() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RAISE EXCEPTION 'refused for the test'; END $$`);
    await sql(`CREATE TRIGGER refuse_route_colour BEFORE INSERT ON brand_colors FOR EACH ROW WHEN (NEW.name = 'Mid grey') EXECUTE FUNCTION refuse_route_colour()`);
    try {
      const r = await designer.post(`${b()}/${set.id}/adopt`, {});
      expect(r.status).toBe(500);
    } finally {
      await sql('DROP TRIGGER refuse_route_colour ON brand_colors');
      await sql('DROP FUNCTION refuse_route_colour()');
    }
    expect(await palette()).toEqual(before);
    expect(await sql(`SELECT 1 FROM audit_events WHERE target_id = $1 AND action = 'palette.replace'`, [set.id])).toHaveLength(0);
  });

  test('replaces the palette with the chosen route in one step, keeping colour ids by role, and the audit keeps the old palette', async () => {
    const { set, link } = await sentSet('Winning routes');
    await new Client().post(`/api/palette-routes/${link.token}/decision`, { name: 'Ada', choice: set.routes[1].id });
    const before = await palette();
    const r = await designer.post(`${b()}/${set.id}/adopt`, {});
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.set.appliedAt).toBeTypeOf('string');
    const after = await palette();
    expect(after.map((c) => [c.name, c.hex, c.role])).toEqual([
      ['Straw', '#e9c46a', 'primary'],
      ['Loam', '#264653', 'text'],
      ['Linen', '#faf6ee', 'background'],
    ]);
    // The primary stays the primary row, so guideline blocks pointing at it show the new colour.
    expect(after.find((c) => c.role === 'primary')!.id).toBe(before.find((c) => c.role === 'primary')!.id);
    const [a] = await sql(`SELECT details FROM audit_events WHERE target_id = $1 AND action = 'palette.replace'`, [set.id]);
    expect(a.details.before.map((c: { name: string; hex: string }) => [c.name, c.hex])).toEqual(before.map((c) => [c.name, c.hex]));
    // Once chosen, the set is closed to changes and to sending.
    expect((await designer.patch(`${b()}/${set.id}`, { title: 'Later' })).status).toBe(409);
  });
});
