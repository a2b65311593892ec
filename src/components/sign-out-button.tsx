import { useState } from 'react';
import { signOut } from 'auth-astro/client';

/** Signs out through Auth.js (CSRF token included) and returns to the landing page. */
export default function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="rounded border border-ground-400 px-3 py-1.5 text-sm text-white hover:bg-ground-700 disabled:opacity-60"
      disabled={busy}
      onClick={() => {
        setBusy(true);
        void signOut({ callbackUrl: '/' } as Parameters<typeof signOut>[0]);
      }}
    >
      {busy ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
