import { useState } from 'react';
import { signOut } from 'auth-astro/client';

/**
 * Signs out through Auth.js (CSRF token included) and returns to the landing page. Staff also
 * get "Sign out everywhere", which ends the account's sessions on every device first.
 */
export default function SignOutButton({ everywhere = false }: { everywhere?: boolean }) {
  const [busy, setBusy] = useState<'here' | 'everywhere' | null>(null);
  const leave = () => void signOut({ callbackUrl: '/' } as Parameters<typeof signOut>[0]);
  return (
    <>
      {everywhere && (
        <button
          type="button"
          className="rounded px-2 py-1.5 text-sm text-ground-100 underline hover:bg-ground-700 disabled:opacity-60"
          disabled={busy !== null}
          data-testid="sign-out-everywhere"
          onClick={async () => {
            setBusy('everywhere');
            await fetch('/api/me/sign-out-everywhere', { method: 'POST' }).catch(() => null);
            leave();
          }}
        >
          {busy === 'everywhere' ? 'Signing out…' : 'Sign out everywhere'}
        </button>
      )}
      <button
        type="button"
        className="rounded border border-ground-400 px-3 py-1.5 text-sm text-white hover:bg-ground-700 disabled:opacity-60"
        disabled={busy !== null}
        onClick={() => {
          setBusy('here');
          leave();
        }}
      >
        {busy === 'here' ? 'Signing out…' : 'Sign out'}
      </button>
    </>
  );
}
