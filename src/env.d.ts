/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, or null; filled by src/middleware.ts on on-demand routes. */
    user: import('./lib/session').SessionUser | null;
    sessionId: string | null;
  }
}
