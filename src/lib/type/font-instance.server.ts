// Static instances of variable fonts for the print edition. Chromium's PDF writer can embed a variable font only as
// Type 3 glyph drawings (no FontFile, poor text in preflight and copy), so the print page asks for one static
// TrueType per weight, cut with harfbuzz's hb-subset (subset-font), every axis pinned.
import { createHash } from 'node:crypto';
import subsetFont from 'subset-font';
import { openFont } from './metrics';

const cache = new Map<string, Promise<Buffer>>();
const MAX_CACHED = 64;

/**
 * A static TrueType of `font` at `weight` (clamped to its wght range), other axes at their defaults; memoised by the
 * font's content, so every version and brand using the same file shares one cut.
 */
export function staticInstance(font: Buffer, weight: number): Promise<Buffer> {
  const cacheKey = `${createHash('sha256').update(font).digest('base64url')}:${weight}`;
  let found = cache.get(cacheKey);
  if (!found) {
    found = (async () => {
      const face = openFont(font);
      const axes: Record<string, number> = {};
      for (const [tag, axis] of Object.entries(face.variationAxes ?? {})) {
        if (axis) axes[tag] = tag === 'wght' ? Math.min(axis.max, Math.max(axis.min, weight)) : axis.default;
      }
      // Every character the face maps, so nothing the guideline sets falls back to another font.
      return subsetFont(font, String.fromCodePoint(...face.characterSet), { targetFormat: 'truetype', variationAxes: axes });
    })();
    found.catch(() => cache.delete(cacheKey));
    if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
    cache.set(cacheKey, found);
  }
  return found;
}
