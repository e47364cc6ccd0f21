// A brand typeface loaded for preview under a private family name, and the CSS stack that falls back from it.
import { useEffect, useState } from 'react';
import type { IdentityTypeface } from '@/lib/identity/types';
import { cssFontFamilyList, cssUrl } from '@/lib/safe/escape';

/** Loads a face from its file under a private family name, so the preview shows the real font. */
export function useFontFace(face: IdentityTypeface | undefined): { family: string | null; state: 'none' | 'loading' | 'ready' | 'failed' } {
  const [state, setState] = useState<'none' | 'loading' | 'ready' | 'failed'>('none');
  const family = face ? `plumbline-preview-${face.id}` : null;
  useEffect(() => {
    if (!face || !family) return setState('none');
    if ([...document.fonts].some((f) => f.family === family && f.status === 'loaded')) return setState('ready');
    let live = true;
    setState('loading');
    const weights = face.metrics.isVariable ? `${face.metrics.weight.min} ${face.metrics.weight.max}` : String(face.metrics.weight.default || 400);
    const ff = new FontFace(family, cssUrl(face.fileUrl), { weight: weights });
    ff.load()
      .then((loaded) => {
        document.fonts.add(loaded);
        if (live) setState('ready');
      })
      .catch(() => live && setState('failed'));
    return () => {
      live = false;
    };
  }, [face, family]);
  return { family, state };
}

/** The CSS font-family for a face: the loaded preview first, then its fallback stack. */
export const stackOf = (family: string | null, face: IdentityTypeface | undefined) =>
  cssFontFamilyList([family, ...(face?.fallback ?? []), 'sans-serif'].filter((f): f is string => !!f));
