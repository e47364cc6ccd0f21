// Palette routes: the contrast shown with each route, the grounds it is read on, the schemas and the e-mails.
import { wcagContrast } from 'culori';
import { describe, expect, test } from 'vitest';
import { renderMail } from '@/lib/mail/templates';
import { routeContrast, routeGrounds } from '@/lib/palette-routes/contrast';
import { createRouteSetBody, routeDecisionBody, routeSchema } from '@/lib/palette-routes/schemas';
import { matchRows } from '@/lib/palette-routes/replace';

const sw = (id: string, hex: string, role: string | null = null) => ({ id, name: id, hex, role });

describe('contrast per route', () => {
  const route = [sw('navy', '#1d3557', 'primary'), sw('sail', '#f1faee', 'background'), sw('buoy', '#e63946', 'accent'), sw('sand', '#e9c46a'), sw('ink', '#111111', 'text')];

  test.each(routeContrast(route).map((p) => [p.text, p.ground, p] as const))('%s on %s matches culori’s wcagContrast (reference library)', (text, ground, pair) => {
    const hex = (id: string) => route.find((c) => c.id === id)!.hex;
    expect(pair.ratio).toBeCloseTo(wcagContrast(hex(text), hex(ground)), 10);
  });

  test.each([
    // WCAG 2.2, definition of contrast ratio: the range is 1:1 to 21:1; black on white is the maximum.
    ['#000000', '#ffffff', '21.00', 'AAA'],
    // #767676 on white is 4.54:1 (from memory: the lightest grey that passes AA on white).
    ['#767676', '#ffffff', '4.54', 'AA'],
    // #777777 on white is 4.48:1 (from memory): below SC 1.4.3's 4.5:1, so only large text (3:1) passes.
    ['#777777', '#ffffff', '4.47', 'AA large'],
    // #959595 on white is 2.99:1 (from memory): below 3:1, so no text level.
    ['#959595', '#ffffff', '2.99', 'fails'],
  ])('%s on %s reads %s:1 (rounded down) and earns %s (WCAG 2.2 SC 1.4.3 / 1.4.6)', (text, ground, shown, verdict) => {
    const [pair] = routeContrast([sw('t', text), sw('g', ground, 'background')]);
    expect(pair).toMatchObject({ text: 't', ground: 'g', shown, verdict });
  });

  test('grounds are the colours marked background; every other colour is text on each of them', () => {
    expect(routeGrounds(route).map((g) => g.id)).toEqual(['sail']);
    expect(routeContrast(route).map((p) => p.text)).toEqual(['navy', 'buoy', 'sand', 'ink']);
  });

  test('without a background role, the lightest and darkest colours are the grounds (by WCAG relative luminance)', () => {
    const unmarked = [sw('teal', '#2a9d8f'), sw('cream', '#fefae0'), sw('coal', '#0b090a'), sw('rust', '#bc6c25')];
    expect(routeGrounds(unmarked).map((g) => g.id)).toEqual(['cream', 'coal']);
    expect(routeContrast(unmarked)).toHaveLength(4);
  });
});

describe('which colour rows a route takes over', () => {
  test('same role first, then the rest in palette order; rows left over are dropped, colours left over are new', () => {
    const rows = [{ id: 'a', role: 'primary' }, { id: 'b', role: 'text' }, { id: 'c', role: 'background' }];
    const incoming = [{ role: 'background' }, { role: 'accent' }, { role: 'primary' }, { role: null }];
    expect(matchRows(rows, incoming).map((r) => r?.id ?? null)).toEqual(['c', 'b', 'a', null]);
    expect(matchRows(rows, [{ role: 'text' }]).map((r) => r?.id)).toEqual(['b']);
  });
});

describe('hostile input', () => {
  const colors = [{ name: 'A', value: '#000000' }, { name: 'B', value: '#ffffff' }];
  test('names with markup are accepted as text (escaped at output); control and bidi characters are refused', () => {
    expect(routeSchema.safeParse({ name: '<b>Bold</b> & "co"', colors }).success).toBe(true);
    expect(routeSchema.safeParse({ name: 'Line\nbreak', colors }).success).toBe(false);
    expect(routeSchema.safeParse({ name: 'Evil\u202etxt', colors }).success).toBe(false);
    expect(routeSchema.safeParse({ name: 'Fine', colors: [{ name: 'A', value: 'url(javascript:alert(1))' }, colors[1]] }).success).toBe(false);
    expect(routeSchema.safeParse({ name: 'Fine', colors, extra: 1 }).success).toBe(false);
  });

  test('a set holds 2 to 4 routes of 2 to 12 colours', () => {
    const r = { name: 'R', colors };
    expect(createRouteSetBody.safeParse({ title: 'T', routes: [r] }).success).toBe(false);
    expect(createRouteSetBody.safeParse({ title: 'T', routes: [r, r] }).success).toBe(true);
    expect(createRouteSetBody.safeParse({ title: 'T', routes: [r, r, r, r, r] }).success).toBe(false);
    expect(createRouteSetBody.safeParse({ title: 'T', routes: [r, { name: 'Big', colors: Array(13).fill(colors[0]) }] }).success).toBe(false);
  });

  test('an answer is a choice or a comment, never neither', () => {
    const id = crypto.randomUUID();
    expect(routeDecisionBody.safeParse({ name: 'Ada', choice: id }).success).toBe(true);
    expect(routeDecisionBody.safeParse({ name: 'Ada', choice: null, comment: 'Not yet' }).success).toBe(true);
    expect(routeDecisionBody.safeParse({ name: 'Ada', choice: null, routes: [{ id, comment: 'Warmer' }] }).success).toBe(true);
    expect(routeDecisionBody.safeParse({ name: 'Ada', choice: null, comment: '  ' }).success).toBe(false);
  });

  test('the e-mails escape names in HTML (OWASP XSS Prevention, rule 1) and keep them as typed in the text', () => {
    const hostile = '<script>alert(1)</script>';
    const request = renderMail('palette-routes-request', { contactName: hostile, senderName: 'Sam', setTitle: hostile, brandName: 'Wendle', routeCount: 2, routeNames: [hostile, 'Hayfield'], message: '', expiresOn: '1 January 2027', link: 'http://localhost/palette/x' });
    expect(request.html).not.toContain('<script>');
    expect(request.html).toContain('<li>&lt;script&gt;alert(1)&lt;/script&gt;</li>');
    expect(request.text).toContain(`- ${hostile}`);
    const decision = renderMail('palette-routes-decision', { contactName: 'Ada', setTitle: 'Spring', brandName: 'Wendle', chosenName: hostile, comment: hostile, routeComments: [`Hayfield: ${hostile}`], link: 'http://localhost/app' });
    expect(decision.html).not.toContain('<script>');
    expect(decision.subject).toBe(`Ada answered on Spring: ${hostile}`);
    const comments = renderMail('palette-routes-decision', { contactName: 'Ada', setTitle: 'Spring', brandName: 'Wendle', chosenName: '', comment: 'Try green', routeComments: [], link: 'http://localhost/app' });
    expect(comments.text).toContain('did not choose a route');
  });
});
