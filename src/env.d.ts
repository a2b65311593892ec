/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    /** The signed-in, active user, filled by src/middleware.ts; null when anonymous. */
    user: import('./lib/server/users.server').SessionUser | null;
  }
}
