// Hostile values: names, notes and addresses that try to leave their place in CSS, HTML, SVG, e-mail or a fetch.
// ASVS 5.0 requirement numbers are from memory of the 5.0 text: V1.2.1 context-aware output encoding, V1.3.6 SSRF
// allow-lists, V1.3.7 template injection, V2.2.1 positive input validation. Reference parsers: css-tree (CSS Syntax
// Level 3 tokenizer and parser) and parse5 (the WHATWG HTML parsing algorithm).
import { readFileSync } from 'node:fs';
import { parse as parseCss, walk } from 'css-tree';
import { parse as parseHtml } from 'parse5';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUpFresh, type Client, joinBrand } from '../support/client';
import { closeDb, sql } from '../support/db';
import { mailTo } from '../support/mailbox';
import { publishAndWait } from '../support/publish';

let owner: Client;
let follower: Client;
let followerEmail: string;
let brandId: string;
let slug: string;
let logoId: string;
let headingFaceId: string;
let inkId: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;
const woff2 = readFileSync('node_modules/@fontsource-variable/dm-sans/files/dm-sans-latin-wght-normal.woff2');
const logoSvg = readFileSync('tests/fixtures/svg/clean-logo.svg');
const ATTACKER = 'attacker.example';

const blocks = () => [
  { type: 'sectionHeading', attrs: { id: 'type', title: 'Type', eyebrow: '', intro: '' } },
  { type: 'typography', attrs: { id: 'faces' } },
  { type: 'colorPalette', attrs: { id: 'palette', colorIds: [inkId], showPrint: false, note: '' } },
  { type: 'clearSpace', attrs: { id: 'space', logoId } },
];

async function saveDraft(content: unknown[]) {
  const { revision } = (await owner.get(api('/guideline'))).body;
  return owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content } });
}

/** Publish the draft and return the published page's HTML. */
async function publishAndRead(note: string): Promise<string> {
  const { version } = await publishAndWait(owner, brandId, note);
  const page = await owner.get(`/b/${slug}/v/${version.number}`);
  expect(page.status).toBe(200);
  return page.body as string;
}

type HtmlNode = { nodeName: string; attrs?: { name: string; value: string }[]; childNodes?: HtmlNode[]; value?: string; content?: HtmlNode };

/** Every element of a parsed document, depth first. */
function elements(node: HtmlNode, out: HtmlNode[] = []): HtmlNode[] {
  if (node.attrs) out.push(node);
  for (const child of node.childNodes ?? []) elements(child, out);
  if (node.content) elements(node.content, out);
  return out;
}
const attr = (el: HtmlNode, name: string) => el.attrs?.find((a) => a.name === name)?.value;
const textOf = (el: HtmlNode): string => (el.childNodes ?? []).map((c) => c.value ?? textOf(c)).join('');

/** Parses CSS with css-tree and returns its parse errors and every declaration as [property, value text]. */
function readCss(source: string, context: 'stylesheet' | 'declarationList') {
  const errors: string[] = [];
  const ast = parseCss(source, { context, positions: false, onParseError: (e: Error) => errors.push(e.message) });
  const declarations: [string, string][] = [];
  walk(ast, { visit: 'Declaration', enter: (d: { property: string; value: unknown }) => declarations.push([d.property, JSON.stringify(d.value)]) });
  return { errors, declarations };
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('hostile-owner'));
  ({ client: follower, email: followerEmail } = await signUpFresh('hostile-follower'));
  const brand = (await owner.post('/api/brands', { name: 'Quillwort Press' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  await joinBrand(owner, brandId, { client: follower, email: followerEmail }, 'viewer');
  expect((await follower.request('PUT', api('/follow'))).status).toBe(200);
  logoId = (await owner.upload(api('/logos'), 'mark.svg', logoSvg, 'image/svg+xml', { variant: 'primary' })).body.logo.id;
  const face = await owner.upload(api('/typefaces'), 'heading.woff2', woff2, 'font/woff2', { role: 'heading', family: 'Quill Sans' });
  expect(face.status).toBe(201);
  headingFaceId = face.body.typeface.id;
  // A confirmed licence puts the face in the published site's @font-face rules.
  expect((await owner.patch(api(`/typefaces/${headingFaceId}`), { licenceConfirmed: true })).status).toBe(200);
  inkId = (await owner.post(api('/colors'), { name: 'Ink', value: '#1d2a3a' })).body.color.id;
  expect((await saveDraft(blocks())).status).toBe(200);
});
afterAll(closeDb);

describe('typeface names at the boundary', () => {
  it.each([
    ['a newline', 'Evil\nbody { color: red }'],
    ['a closing brace', 'Evil } body { background: red'],
    ['a </style> end tag', 'Evil</style><script>alert(1)</script>'],
    ['a quote and a url()', `Evil"; src: url(https://${ATTACKER}/x.woff2)`],
  ])('V2.2.1 (ASVS 5.0) a family name holding %s is refused with 400 and the saved typefaces are unchanged', async (_what, family) => {
    const before = await sql('SELECT id, family, fallback FROM brand_typefaces WHERE brand_id = $1 ORDER BY id', [brandId]);
    const r = await owner.upload(api('/typefaces'), 'evil.woff2', woff2, 'font/woff2', { role: 'body', family });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.message).toMatch(/letters, digits, spaces, hyphens, apostrophes and full stops/);
    expect(await sql('SELECT id, family, fallback FROM brand_typefaces WHERE brand_id = $1 ORDER BY id', [brandId])).toEqual(before);
  });

  it('V2.2.1 (ASVS 5.0) a fallback font that would end the CSS block is refused with 400 and the stack is unchanged', async () => {
    const before = await sql('SELECT fallback FROM brand_typefaces WHERE id = $1', [headingFaceId]);
    const r = await owner.patch(api(`/typefaces/${headingFaceId}`), { fallback: ['Georgia', 'x } body { background: red'] });
    expect(r.status).toBe(400);
    expect(await sql('SELECT fallback FROM brand_typefaces WHERE id = $1', [headingFaceId])).toEqual(before);
  });
});

describe('hostile values already stored (written with SQL, past every schema)', () => {
  const hostileFamily = `Evil\n"; } body { background: url(https://${ATTACKER}/x) } </style><script>alert(1)</script>`;

  it('V1.2.1 (ASVS 5.0) CSS: a hostile family in an old row comes out as one escaped CSS string in @font-face and in style attributes (CSSOM "serialize a string", CSS Syntax Level 3 via css-tree)', async () => {
    await sql(`UPDATE brand_typefaces SET family = $1, fallback = $2::jsonb WHERE id = $3`, [hostileFamily, JSON.stringify(['Georgia', 'x}</style><script>alert(2)</script>']), headingFaceId]);
    const html = await publishAndRead('Hostile family');
    const editorPage = (await owner.get(`/app/brands/${brandId}/guidelines`)).body as string;
    for (const page of [html, editorPage]) {
      expect(page).not.toContain('<script>alert(');
      const doc = parseHtml(page) as unknown as HtmlNode;
      const all = elements(doc);
      expect(all.filter((el) => el.nodeName === 'script' && textOf(el).includes('alert('))).toEqual([]);
      const styles = all.filter((el) => el.nodeName === 'style').map(textOf);
      for (const css of styles) {
        const { errors, declarations } = readCss(css, 'stylesheet');
        expect(errors).toEqual([]);
        expect(declarations.filter(([p, v]) => p.startsWith('background') && v.includes(ATTACKER))).toEqual([]);
        for (const [p, v] of declarations.filter(([p]) => p === 'src')) expect(v, p).not.toContain(ATTACKER);
      }
      for (const style of all.map((el) => attr(el, 'style')).filter((s): s is string => !!s && s.includes('font'))) {
        const { errors, declarations } = readCss(style, 'declarationList');
        expect(errors, style).toEqual([]);
        expect(declarations.filter(([p]) => p.startsWith('background'))).toEqual([]);
      }
    }
    const faces = parseHtml(html) as unknown as HtmlNode;
    const fontFace = elements(faces).filter((el) => el.nodeName === 'style').map(textOf).find((css) => css.includes('@font-face'))!;
    expect(fontFace).toBeDefined();
    const { declarations } = readCss(fontFace, 'stylesheet');
    const family = declarations.find(([p]) => p === 'font-family')!;
    expect(JSON.parse(family[1]).children.map((c: { type: string }) => c.type)).toEqual(['String']);
    await sql(`UPDATE brand_typefaces SET family = 'Quill Sans', fallback = '["Georgia","serif"]'::jsonb WHERE id = $1`, [headingFaceId]);
  });

  it('V1.2.1 (ASVS 5.0) HTML: a colour and a logo named with markup come out as text in the published page (OWASP XSS Prevention Cheat Sheet, rule 1)', async () => {
    await sql(`UPDATE brand_colors SET name = $1 WHERE brand_id = $2`, ['<img src=x onerror=alert(3)>', brandId]);
    await sql(`UPDATE brand_logos SET name = $1 WHERE id = $2`, ['"><svg onload=alert(4)>', logoId]);
    const html = await publishAndRead('Hostile names');
    const all = elements(parseHtml(html) as unknown as HtmlNode);
    expect(all.filter((el) => el.nodeName === 'img' && attr(el, 'src') === 'x')).toEqual([]);
    expect(all.filter((el) => el.attrs?.some((a) => a.name.startsWith('on')))).toEqual([]);
    expect(html).toContain('&lt;img src=x onerror=alert(3)&gt;');
  });

  it('V1.2.1 (ASVS 5.0) SVG: a hostile logo name in the generated clear-space diagram stays inside its attribute (XML 1.0 §3.1 AttValue)', async () => {
    const html = (await owner.get(`/b/${slug}`)).body as string;
    const svgs = elements(parseHtml(html) as unknown as HtmlNode).filter((el) => el.nodeName === 'svg');
    const diagram = svgs.find((el) => attr(el, 'aria-label')?.startsWith('Clear space around'));
    expect(diagram).toBeDefined();
    expect(attr(diagram!, 'aria-label')).toBe('Clear space around "><svg onload=alert(4)>');
    expect(svgs.filter((el) => attr(el, 'onload') !== undefined)).toEqual([]);
    await sql(`UPDATE brand_logos SET name = 'Mark' WHERE id = $1`, [logoId]);
  });
});

describe('e-mail', () => {
  it('V1.3.7 (ASVS 5.0) template injection: colours named {{{note}}} and <img src=x onerror=…> reach the follower’s e-mail as inert text', async () => {
    for (const name of ['{{{note}}}', '<img src=x onerror=alert(5)>']) expect((await owner.post(api('/colors'), { name, value: '#a33b20' })).status).toBe(201);
    await publishAndRead('<b>raw note</b> {{{note}}}');
    // The notice goes out from a queue job once the version is ready (earlier versions' notices may still be arriving).
    const ours = () => mailTo(followerEmail).filter((m) => m.text.includes('<b>raw note</b>'));
    for (let i = 0; i < 100 && ours().length === 0; i++) await new Promise((r) => setTimeout(r, 100));
    expect(ours()).toHaveLength(1);
    const [mail] = ours();
    // The note is shown once, escaped; the colour names stay literal text, never rendered a second time.
    expect(mail.html.match(/&lt;b&gt;raw note&lt;\/b&gt;/g)).toHaveLength(1);
    expect(mail.html).not.toContain('<b>raw note</b>');
    expect(mail.html).toContain('Colour {{{note}}}: added');
    expect(mail.html).toContain('Colour &lt;img src=x onerror=alert(5)&gt;: added');
    const all = elements(parseHtml(mail.html) as unknown as HtmlNode);
    expect(all.filter((el) => el.nodeName === 'img' || el.nodeName === 'b')).toEqual([]);
    expect(all.filter((el) => el.attrs?.some((a) => a.name.startsWith('on')))).toEqual([]);
    expect(mail.text).toContain('Colour {{{note}}}: added');
    expect(mail.text).toContain('<b>raw note</b> {{{note}}}');
  });
});

describe('imagery comes from the shelf', () => {
  const imagery = (src: string) => ({ type: 'imagery', attrs: { id: 'photos', items: [{ src, alt: 'A photo', verdict: 'do', caption: '' }], columns: 2 } });

  it('V1.3.6 (ASVS 5.0) SSRF: an imagery block pointing at an outside address is refused with 400, a clear message, and the draft unchanged', async () => {
    const before = (await owner.get(api('/guideline'))).body.revision;
    for (const src of [`https://${ATTACKER}/cat.png`, `//${ATTACKER}/cat.png`, 'http://169.254.169.254/latest/meta-data/', 'file:///etc/passwd']) {
      const r = await saveDraft([...blocks(), imagery(src)]);
      expect(r.status, src).toBe(400);
      expect(r.body.error.message).toMatch(/asset shelf; outside addresses are not accepted/);
    }
    expect((await owner.get(api('/guideline'))).body.revision).toBe(before);
  });

  it('V1.3.6 (ASVS 5.0) SSRF: an asset id of another brand’s shelf is refused with 400', async () => {
    const other = (await owner.post('/api/brands', { name: 'Elsewhere Ltd' })).body.brand.id;
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#336699' } }).png().toBuffer();
    const up = await owner.upload(`/api/brands/${other}/assets`, 'other.png', png, 'image/png', { kind: 'image' });
    expect(up.status).toBe(201);
    const r = await saveDraft([...blocks(), imagery(up.body.assets[0].id)]);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/asset shelf/);
  });

  it('V1.3.6 (ASVS 5.0) SSRF: an approved image of the brand’s own shelf is served from the version’s own copy', async () => {
    const png = await sharp({ create: { width: 16, height: 12, channels: 3, background: '#c0a060' } }).png().toBuffer();
    const up = await owner.upload(api('/assets'), 'shore.png', png, 'image/png', { kind: 'image' });
    expect(up.status).toBe(201);
    const assetId = up.body.assets[0].id;
    expect((await owner.patch(api(`/assets/${assetId}`), { state: 'approved' })).status).toBe(200);
    expect((await saveDraft([...blocks(), imagery(assetId)])).status).toBe(200);
    const html = await publishAndRead('Shelf image');
    const img = elements(parseHtml(html) as unknown as HtmlNode).find((el) => el.nodeName === 'img' && attr(el, 'alt') === 'A photo');
    expect(attr(img!, 'src')).toMatch(new RegExp(`^/b/${slug}/v/\\d+/files/${assetId}$`));
    const file = await owner.request('GET', attr(img!, 'src')!);
    expect(file.status).toBe(200);
    expect(file.headers.get('content-type')).toBe('image/png');
  });

  it('V1.3.6 (ASVS 5.0) SSRF: an outside address already in a stored draft is shown as a frame and never reaches the published version', async () => {
    const draft = (await owner.get(api('/guideline'))).body.doc;
    draft.content.push({ type: 'imagery', attrs: { id: 'old-photos', items: [{ src: `https://${ATTACKER}/cat.png`, alt: 'Old', verdict: 'do', caption: '' }], columns: 1 } });
    await sql(`UPDATE guideline_drafts SET doc = $1::jsonb WHERE brand_id = $2`, [JSON.stringify(draft), brandId]);
    const html = await publishAndRead('Old outside image');
    expect(html).not.toContain(ATTACKER);
    expect(html).toContain('Image to come');
    const [row] = await sql(`SELECT snapshot::text AS s FROM guideline_versions WHERE brand_id = $1 ORDER BY number DESC LIMIT 1`, [brandId]);
    expect(row.s).not.toContain(ATTACKER);
  });
});
