import type { Role } from '@shared/roles';
import type { Page } from 'playwright-core';

/** The demo accounts seeded on first start (reserved `.example` domain, RFC 2606). */
export const DEMO_PASSWORD = 'driftcase-demo';
export const demoEmail = (role: Role) => `${role}@driftcase.example`;

export async function fillSignIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in through the form, as a person would, and waits for the app shell. */
export async function signInAs(page: Page, role: Role) {
  await fillSignIn(page, demoEmail(role), DEMO_PASSWORD);
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}
