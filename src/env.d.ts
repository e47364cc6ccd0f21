/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, or null for an anonymous visitor. */
    user: import('./lib/auth/auth.server').AuthSession['user'] | null;
    session: import('./lib/auth/auth.server').AuthSession['session'] | null;
    /** Read access to one brand's published site through a share link (no account), when its cookie is present. */
    shareGrant: { brandId: string; linkId: string; allowDownloads: boolean; allowPresentation: boolean; version: number | null } | null;
    /** The TCP peer's address, set by scripts/serve.mjs; read it through requestClientAddress(), never directly. */
    socketAddress?: string;
    /** This request's id (src/middleware.ts): in every log line written while it is served and its X-Request-Id. */
    requestId?: string;
  }
}
