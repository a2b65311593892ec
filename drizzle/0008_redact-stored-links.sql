-- E-mails stored before links were redacted still carry live sign-in links: replace each link
-- that carries a token (or points at the sign-in callback) with the same words the app now stores.
UPDATE "email_log"
SET "text" = regexp_replace("text", 'https?://[^[:space:]<>"'']*(/api/auth/callback/|[?&](token|code|key|signature)=)[^[:space:]<>"'']*', '[sign-in link — sent to the customer, not kept]', 'gi')
WHERE "text" ~* '(/api/auth/callback/|[?&](token|code|key|signature)=)';
