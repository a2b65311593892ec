// Reads the fake mail service's inbox (fake-services/mail-server.mjs) over its HTTP API.
export type Message = { id: string; to: string; from: string; subject: string; text: string; html: string; date: string };

const mailApi = () => {
  const url = process.env.MAIL_API_URL;
  if (!url) throw new Error('MAIL_API_URL is not set: run tests through `npm test`.');
  return url;
};

export async function messagesTo(to: string): Promise<Message[]> {
  const res = await fetch(`${mailApi()}/api/messages?to=${encodeURIComponent(to)}`);
  return (await res.json()) as Message[];
}

/** Waits for the n-th message to an address (1-based), as mail arrives asynchronously. */
export async function waitForMessage(to: string, n = 1, timeoutMs = 10_000): Promise<Message> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const list = await messagesTo(to);
    if (list.length >= n) return list[n - 1]!;
    if (Date.now() > until) throw new Error(`no message #${n} to ${to} within ${timeoutMs} ms (have ${list.length})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The first link in a message's text that points at the app. */
export function linkIn(message: Message, startsWith: string): string {
  const match = message.text.match(/https?:\/\/\S+/g)?.find((u) => u.startsWith(startsWith));
  if (!match) throw new Error(`no ${startsWith} link in message "${message.subject}"`);
  return match;
}
