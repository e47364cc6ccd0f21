// The twelve standard renditions of one logo through Plumbline (cold: nothing cached; cached: second request)
// against a plain sharp loop doing the same drawing in the same run. Goal: cold ≤ 1.2× the plain loop.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { encode as encodeIco } from 'sharp-ico';
import { inspectUpload } from '@/lib/uploads/inspect.server';
import { STANDARD_RENDITIONS } from '@/lib/assets/kinds';
import { cachedRendition } from '@/lib/assets/render.server';
import { resolveRendition } from '@/lib/assets/renditions';
import { LocalDiskStorage } from '@/lib/storage/local-disk.server';

// An invented lockup of our own: a mark and a word-shaped bar.
const LOGO = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 240 80"><circle cx="40" cy="40" r="28" fill="#25433a"/><path d="M28 40h24M40 28v24" stroke="#f2e7d5" stroke-width="5"/><rect x="84" y="28" width="140" height="24" rx="4" fill="#b4532a"/></svg>';
const ROUNDS = 5;

/** The same twelve files, written straight against sharp. */
async function plainLoop(svg: string, bounds: { x: number; y: number; width: number; height: number }): Promise<number> {
  const w0 = 240;
  const h0 = 80;
  const at = (width: number, text = svg) => sharp(Buffer.from(text), { density: (72 * width) / w0 });
  const ink = (hex: string) => svg.replace(/(fill|stroke)="#[0-9a-f]{6}"/gi, `$1="${hex}"`);
  const squareOf = (size: number, pad: number, background: string | { r: number; g: number; b: number; alpha: number }) => {
    const inner = Math.round(size * (1 - 2 * pad));
    const cw = inner;
    const ch = Math.round((inner * h0) / w0);
    const top = Math.floor((size - ch) / 2);
    const left = Math.floor((size - cw) / 2);
    return at(cw).resize({ width: cw, height: ch, fit: 'fill' }).extend({ top, bottom: size - ch - top, left, right: size - cw - left, background });
  };
  const clear = { r: 0, g: 0, b: 0, alpha: 0 };
  const out: Buffer[] = [];
  out.push(await at(512).resize({ width: 512 }).png().toBuffer());
  out.push(await at(2048).resize({ width: 2048 }).png().toBuffer());
  out.push(await at(1024).resize({ width: 1024 }).flatten({ background: '#ffffff' }).jpeg({ quality: 90 }).toBuffer());
  out.push(await at(1024).resize({ width: 1024 }).webp({ quality: 90 }).toBuffer());
  out.push(await at(512, ink('#000000')).resize({ width: 512 }).png().toBuffer());
  out.push(await at(512, ink('#ffffff')).resize({ width: 512 }).png().toBuffer());
  out.push(encodeIco(await Promise.all([16, 32, 48].map((s) => squareOf(s, 0, clear).png().toBuffer()))));
  out.push(await squareOf(180, 0.1, '#ffffff').flatten({ background: '#ffffff' }).png().toBuffer());
  out.push(await squareOf(192, 0.05, clear).png().toBuffer());
  out.push(await squareOf(512, 0.05, clear).png().toBuffer());
  {
    const dw = bounds.width * w0;
    const dh = bounds.height * h0;
    const scale = 800 / Math.max(dw + dh / 2, 1.5 * dh);
    const cw = Math.round(dw * scale);
    const ch = Math.round(dh * scale);
    const canvas = cw / bounds.width;
    const full = Math.floor(canvas);
    const img = sharp(Buffer.from(svg), { density: (72 * canvas) / w0 }).extract({
      left: Math.floor(bounds.x * full),
      top: Math.floor(bounds.y * Math.floor((full * h0) / w0)),
      width: Math.ceil(bounds.width * full),
      height: Math.ceil(bounds.height * Math.floor((full * h0) / w0)),
    });
    const top = Math.floor((800 - ch) / 2);
    const left = Math.floor((800 - cw) / 2);
    out.push(await img.resize({ width: cw, height: ch, fit: 'fill' }).extend({ top, bottom: 800 - ch - top, left, right: 800 - cw - left, background: '#ffffff' }).flatten({ background: '#ffffff' }).png().toBuffer());
  }
  out.push(await at(2048).resize({ width: 2048 }).flatten({ background: '#ffffff' }).withIccProfile('cmyk').tiff({ compression: 'lzw' }).toBuffer());
  return out.reduce((s, b) => s + b.length, 0);
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export default async function bench(): Promise<void> {
  const logo = await inspectUpload(Buffer.from(LOGO), { as: 'shelf', filename: 'bench-lockup.svg' });
  const bounds = logo.drawn!.fraction;
  const jobs = STANDARD_RENDITIONS.map((r) => resolveRendition(r.query, { kind: 'logo', format: 'svg' }));
  sharp.cache(false); // neither side may profit from libvips' operation cache
  await plainLoop(logo.stored.toString(), bounds); // warm-up: load libvips, fonts, codecs

  const plain: number[] = [];
  const cold: number[] = [];
  const cached: number[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
    const store = new LocalDiskStorage(dir);
    const source = { id: crypto.randomUUID(), brandId: crypto.randomUUID(), format: 'svg' as const, drawnBounds: bounds, bytes: async () => logo.stored };
    let t = performance.now();
    await plainLoop(logo.stored.toString(), bounds);
    plain.push(performance.now() - t);
    t = performance.now();
    for (const p of jobs) await cachedRendition(store, source, p);
    cold.push(performance.now() - t);
    t = performance.now();
    for (const p of jobs) {
      const r = await cachedRendition(store, source, p);
      if (!r.cached) throw new Error('expected a cached rendition on the second pass');
    }
    cached.push(performance.now() - t);
    rmSync(dir, { recursive: true, force: true });
  }
  const base = median(plain);
  console.log(`12 renditions of one SVG logo, median of ${ROUNDS} rounds`);
  console.log(`  plain sharp loop      ${base.toFixed(1)} ms (baseline)`);
  console.log(`  Plumbline, cold       ${median(cold).toFixed(1)} ms  ratio ${(median(cold) / base).toFixed(2)}× (goal ≤ 1.2×)`);
  console.log(`  Plumbline, cached     ${median(cached).toFixed(1)} ms  ratio ${(median(cached) / base).toFixed(2)}×`);
}
