/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, or null for an anonymous visitor. */
    user: import('./lib/auth/auth.server').AuthSession['user'] | null;
    session: import('./lib/auth/auth.server').AuthSession['session'] | null;
  }
}
