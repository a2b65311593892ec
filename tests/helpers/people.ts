// Sign-in helpers built on the factories: each test gets its own fresh people.
import { Client, baseUrl, signInWithPassword } from './http';
import { linkIn, waitForMessage } from './mail';
import { db } from './db';
import { createUser, createCase, type CaseInput } from '../../seeds/factories';

export const TEST_PASSWORD = 'correct horse battery staple';

export async function newStaff(role: 'admin' | 'surveyor') {
  const user = await createUser(db, { role, password: TEST_PASSWORD });
  const client = await signInWithPassword(user.email, TEST_PASSWORD);
  return { user, client };
}

/** A new customer signed in by following the e-mailed link, as a real customer would. */
export async function newCustomer(caseInput: Omit<CaseInput, 'customerId'> | null = {}) {
  const user = await createUser(db, { role: 'customer', name: 'Test Customer' });
  const theCase = caseInput ? await createCase(db, { ...caseInput, customerId: user.id }) : null;
  const client = await signInWithLink(user.email);
  return { user, client, case: theCase };
}

/**
 * Signs in through the e-mailed link. The link is built from the app's APP_URL (`linkOrigin`);
 * to follow it through one particular node behind a load balancer, pass that node as `base`.
 */
export async function signInWithLink(email: string, nth?: number, base = baseUrl, linkOrigin = base): Promise<Client> {
  const client = new Client(base);
  const r = await client.authPost('/api/auth/signin/nodemailer', { email, callbackUrl: '/home' });
  if (r.status !== 200) throw new Error(`link request failed: ${r.status}`);
  const message = await waitForMessage(email, nth ?? 1);
  const link = new URL(linkIn(message, linkOrigin));
  const res = await client.fetch(new URL(link.pathname + link.search, base).href);
  if (res.status !== 302 || (res.headers.get('location') ?? '').includes('error=')) {
    throw new Error(`link sign-in failed: ${res.status} ${res.headers.get('location')}`);
  }
  return client;
}
