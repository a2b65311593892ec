import { describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { newCustomer, newStaff } from '../helpers/people';

describe('who may see what', () => {
  it('answers anonymous API calls with 401 in the JSON error shape', async () => {
    const { status, body } = await new Client().json('/api/me');
    expect(status).toBe(401);
    expect(body).toEqual({ error: { code: 'unauthenticated', message: expect.any(String) } });
  });

  it('answers an unknown API route with JSON 404', async () => {
    const { status, body } = await new Client().json('/api/no-such-thing');
    expect(status).toBe(404);
    expect(body.error.code).toBe('not_found');
  });

  it('sends anonymous visitors of a home page to sign-in, remembering where they were going', async () => {
    for (const path of ['/my', '/office', '/surveys']) {
      const res = await new Client().fetch(path);
      expect(res.status).toBe(302);
      expect(res.headers.get('location')).toBe(`/signin?callbackUrl=${encodeURIComponent(path)}`);
    }
  });

  it('keeps a customer off staff pages, and staff off the customer page', async () => {
    const { client: customer } = await newCustomer();
    expect((await customer.fetch('/office')).headers.get('location')).toBe('/my');
    expect((await customer.fetch('/surveys')).headers.get('location')).toBe('/my');
    expect((await customer.fetch('/my')).status).toBe(200);
    const { client: surveyor } = await newStaff('surveyor');
    expect((await surveyor.fetch('/office')).headers.get('location')).toBe('/surveys');
    expect((await surveyor.fetch('/my')).headers.get('location')).toBe('/surveys');
    const { client: admin } = await newStaff('admin');
    expect((await admin.fetch('/office')).status).toBe(200);
    expect((await admin.fetch('/my')).headers.get('location')).toBe('/office');
  });

  it('shows each role its own home page', async () => {
    const { client: customer, user } = await newCustomer({ addressLine1: '1 Test Street', town: 'Quillbury', postcode: 'AB1 2DE' });
    const page = await (await customer.fetch('/my')).text();
    expect(page).toContain('1 Test Street');
    expect(page).toContain('Hello, Test');
    expect(user.role).toBe('customer');
  });
});
