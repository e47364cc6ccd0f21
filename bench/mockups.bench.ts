// A business card mock-up (PNG and PDF) over HTTP: a new drawing (the palette changed, so the inputs are new) against
// the same drawing asked again, which is read back from storage. Goal: a kept drawing ≤ 0.2× a new one.
import { benchServer, call, median } from './support/server';

const ROUNDS = 5;
// An invented mark of our own: a ring and a bar.
const MARK = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 120 60"><circle cx="30" cy="30" r="20" fill="#25433a"/><rect x="60" y="20" width="40" height="20" fill="#b4532a"/></svg>';

export default async function mockupsBench(): Promise<void> {
  const server = await benchServer();
  const cookie = await server.signUp('bench-mockups');
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: 'Bench Mockups Co' })).brand;
  const form = new FormData();
  form.append('variant', 'primary');
  form.append('file', new Blob([MARK], { type: 'image/svg+xml' }), 'mark.svg');
  const up = await fetch(`${server.baseUrl}/api/brands/${brand.id}/logos`, { method: 'POST', headers: { origin: server.baseUrl, cookie }, body: form });
  if (!up.ok) throw new Error(`logo upload → ${up.status}`);
  await call(server, cookie, 'POST', `/api/brands/${brand.id}/colors`, { name: 'Ink', value: '#1d2a44', role: 'primary' });
  const paper = (await call(server, cookie, 'POST', `/api/brands/${brand.id}/colors`, { name: 'Paper', value: '#f4efe6', role: 'secondary' })).color;

  const time = async (format: 'png' | 'pdf') => {
    const t0 = performance.now();
    const r = await fetch(`${server.baseUrl}/api/brands/${brand.id}/mockups/business-card?format=${format}`, { headers: { cookie } });
    if (!r.ok) throw new Error(`mock-up → ${r.status}: ${(await r.text()).slice(0, 200)}`);
    await r.arrayBuffer();
    return performance.now() - t0;
  };
  for (const format of ['png', 'pdf'] as const) {
    await time(format); // warm up the print browser
    const fresh: number[] = [];
    const kept: number[] = [];
    for (let i = 0; i < ROUNDS; i++) {
      // A new ground for the pattern: new inputs, so a new drawing.
      await call(server, cookie, 'PATCH', `/api/brands/${brand.id}/colors/${paper.id}`, { value: `#f4ef${(0xe0 + i * 3 + (format === 'pdf' ? 1 : 0)).toString(16)}` });
      fresh.push(await time(format));
      kept.push(await time(format));
    }
    console.log(`business card ${format.toUpperCase()}: new drawing median ${median(fresh).toFixed(0)} ms, kept drawing ${median(kept).toFixed(0)} ms → ${(median(kept) / median(fresh)).toFixed(2)}× (goal ≤ 0.2×)`);
  }
}
