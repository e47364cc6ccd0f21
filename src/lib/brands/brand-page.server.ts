// Shared loading for the signed-in brand pages: sign-in redirect, policy check, 404 for brands out of reach.
import type { AstroGlobal } from 'astro';
import { authorizeBrand } from '@/lib/auth/access.server';
import type { BrandAction } from '@/lib/auth/policy';
import { AppError } from '@/lib/errors';
import { idParam } from '@/lib/http/api';

/** The brand and the caller's role for a page under /app/brands/:id, or the Response to send instead. */
export async function brandPage(Astro: AstroGlobal, action: BrandAction = 'brand.read') {
  if (!Astro.locals.user) return { response: Astro.redirect(`/sign-in?next=${encodeURIComponent(Astro.url.pathname)}`) } as const;
  try {
    const access = await authorizeBrand(Astro.locals, idParam(Astro.params.id), action);
    return { ...access, response: null } as const;
  } catch (err) {
    // An account that has not proven its address is sent to the dashboard, which says how to.
    if (err instanceof AppError && err.code === 'email_unverified') return { response: Astro.redirect('/app') } as const;
    if (err instanceof AppError && (err.status === 404 || err.status === 403)) {
      return { response: new Response(err.status === 404 ? 'Not found' : 'Your role on this brand does not open this page.', { status: err.status }) } as const;
    }
    throw err;
  }
}
