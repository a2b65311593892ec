import { afterAll, describe, expect, it } from 'vitest';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap } from './browser';
import { db } from '../helpers/db';
import { linkIn, waitForMessage } from '../helpers/mail';
import { createCase, createUser } from '../../seeds/factories';
import { baseUrl } from './browser';

afterAll(close);

describe('signing in, in Chromium', () => {
  it('a customer asks for a link, follows it from the inbox and lands on their home', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Hana Pemberton' });
    await createCase(db, { customerId: user.id, addressLine1: '5 Kestrel Walk', town: 'Quillbury', postcode: 'AB1 2DE' });
    const { page, context } = await newPage(PHONE);
    await page.goto('/');
    await snap(page, 'landing-390');
    await page.getByRole('link', { name: 'Sign in to start' }).click();
    await page.locator('[data-ready="true"]').waitFor();
    await page.getByLabel('E-mail address').fill(user.email);
    await snap(page, 'signin-390');
    await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
    await page.getByTestId('check-email').waitFor();
    const link = linkIn(await waitForMessage(user.email), baseUrl);
    await page.goto(link);
    await page.waitForURL('**/my');
    await expect(page.getByTestId('home-heading').textContent()).resolves.toContain('Hello, Hana');
    await expect(page.getByText('5 Kestrel Walk').count()).resolves.toBe(1);
    await snap(page, 'customer-home-390');
    await page.setViewportSize(DESKTOP);
    await snap(page, 'customer-home-1280');
    await page.goto('/');
    await snap(page, 'landing-1280');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('a staff member sees a clear error for a wrong password, then signs in', async () => {
    const { page, context } = await newPage(DESKTOP);
    await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
    await page.getByRole('tab', { name: 'Installer staff' }).click();
    await page.getByLabel('E-mail address').fill('admin@example.com');
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').textContent()).resolves.toContain("don't match an active staff account");
    await snap(page, 'signin-error-1280');
    await page.getByLabel('Password').fill(process.env.DEMO_PASSWORD ?? 'groundwork-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/office');
    await snap(page, 'office-home-1280');
    await expect(page.getByTestId('home-heading').textContent()).resolves.toBe('Cases');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('a validation message shows before anything is sent', async () => {
    const { page, context } = await newPage(PHONE);
    await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
    await page.getByLabel('E-mail address').fill('not-an-email');
    await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
    await expect(page.getByText('Enter an e-mail address like name@example.com.').count()).resolves.toBe(1);
    await context.close();
  });
});
