/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    user: import('./lib/server/auth').SignedInUser | null;
    /** Id of the current session (the SHA-256 of the cookie token), when signed in. */
    sessionId: string | null;
  }
}
