import { ROLES, type Role } from '@shared/roles';
import { describe, expect, it } from 'vitest';
import { saveScreenshot, useBrowser } from './support/browser';
import { DEMO_PASSWORD, demoEmail, fillSignIn, signInAs } from './support/sign-in';

// The navigation each role must see, as the foundation issue's role table specifies it.
const EXPECTED_NAVIGATION: Record<Role, string[]> = {
  // Help (the glossary page) is for every role.
  investigator: ['Cases', 'New case', 'Help'],
  reviewer: ['Cases', 'Review queue', 'Help'],
  legal: ['Cases', 'Help'],
  engineer: ['Cases', 'Help'],
  admin: ['Cases', 'Users', 'Outbox', 'Keys and evidence', 'Help'],
};

const ROLE_NAMES: Record<Role, string> = {
  investigator: 'Investigator',
  reviewer: 'Safety reviewer',
  legal: 'Legal',
  engineer: 'Engineer',
  admin: 'Administrator',
};

describe('signing in', () => {
  const browser = useBrowser();

  for (const role of ROLES) {
    it(`shows the ${role}'s navigation`, async () => {
      const page = await browser.open();
      await signInAs(page, role);
      expect(page.url()).toMatch(/\/cases$/);
      const links = await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents();
      // The first link is the wordmark, which returns home.
      expect(links.slice(1).map((text) => text.trim())).toEqual(EXPECTED_NAVIGATION[role]);
      expect(await page.getByTestId('user-role').textContent()).toBe(ROLE_NAMES[role]);
      await page.context().close();
    });
  }

  it('answers a wrong password with the generic message and stays on the form', async () => {
    const page = await browser.open();
    await fillSignIn(page, demoEmail('reviewer'), `${DEMO_PASSWORD}-wrong`);
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.textContent()).toContain('That e-mail and password do not match an active account.');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await saveScreenshot(page, 'sign-in-error');
    await page.context().close();
  });

  it('sends a signed-out visitor to sign-in and back to the page they asked for', async () => {
    const page = await browser.open();
    await page.goto('/cases?severity=high');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/cases?severity=high');
    await page.getByLabel('E-mail').fill(demoEmail('legal'));
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/cases\?severity=high$/);
    expect(await page.getByLabel('Severity').inputValue()).toBe('high');
    await page.context().close();
  });

  it('tells an engineer that the user admin page is not for their role', async () => {
    const page = await browser.open();
    await signInAs(page, 'engineer');
    await page.goto('/admin/users');
    await page.getByText('Not available for your role').waitFor();
    await page.context().close();
  });

  it('shows a not-found page inside the shell for an unknown address', async () => {
    const page = await browser.open();
    await signInAs(page, 'legal');
    await page.goto('/no-such-page');
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(true);
    await page.goto('/cases/00000000-0000-4000-8000-000000000000');
    await page.getByText('Case not found').waitFor();
    await page.context().close();
  });

  it('signs out from the user menu', async () => {
    const page = await browser.open();
    await signInAs(page, 'reviewer');
    await page.getByRole('button', { name: /Account menu/ }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.goto('/cases');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.context().close();
  });
});
