// Reads the fake SMS and vehicle enquiry services (fake-services/) over their HTTP APIs.
const need = (name: string) => {
  const url = process.env[name];
  if (!url) throw new Error(`${name} is not set: run tests through \`npm test\`.`);
  return url;
};

export type FakeText = { id: string; to: string; from: string; text: string; status: string; receiptAnswer: number | null; date: string };

/** Texts the fake took for a number (E.164 with or without +). */
export async function textsTo(mobile: string): Promise<FakeText[]> {
  const res = await fetch(`${need('SMS_API_URL')}/api/sms?to=${encodeURIComponent(mobile.replace(/^\+/, ''))}`);
  return (await res.json()) as FakeText[];
}

/** The fake plays a reply from the customer's phone, signed as the provider signs it. */
export async function replyFrom(mobile: string, text: string): Promise<{ delivered: number }> {
  const res = await fetch(`${need('SMS_API_URL')}/api/sms/reply`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ from: mobile, text }) });
  return (await res.json()) as { delivered: number };
}

/** The fake sends another delivery receipt for a text it took. */
export async function receiptFor(providerId: string, status: string, errCode = '0'): Promise<{ delivered: number }> {
  const res = await fetch(`${need('SMS_API_URL')}/api/sms/${providerId}/receipt`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ status, errCode }) });
  return (await res.json()) as { delivered: number };
}

/** Registrations the fake vehicle service was asked about, oldest first. */
export async function vehicleRequests(): Promise<{ registrationNumber: string }[]> {
  return (await (await fetch(`${need('VEHICLE_API_URL')}/api/requests`)).json()) as { registrationNumber: string }[];
}

/** A UK mobile number no other test uses: 07400 and six random digits. */
export const uniqueMobile = () => `+447400${String(Math.floor(Math.random() * 1e6)).padStart(6, '0')}`;

export async function until<T>(fn: () => Promise<T>, ok: (v: T) => boolean, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (ok(v) || Date.now() > end) return v;
    await new Promise((r) => setTimeout(r, 100));
  }
}
