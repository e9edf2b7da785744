import { describe, expect, it } from 'vitest';
import { saveScreenshot, useBrowser } from './support/browser';
import { fillSignIn, signInAs } from './support/sign-in';

describe('user admin', () => {
  const browser = useBrowser();

  it('an admin adds a user, changes their role and deactivates them', async () => {
    const page = await browser.open();
    await signInAs(page, 'admin');
    await page.getByRole('link', { name: 'Users' }).click();
    await page.getByRole('heading', { name: 'Users' }).waitFor();

    const email = `noor.haddad.${Date.now()}@driftcase.example`;
    const password = 'long-enough-secret-42';
    await page.getByRole('button', { name: 'Add user' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a user' });
    await dialog.getByLabel('Name').fill('Noor Haddad');
    await dialog.getByLabel('E-mail').fill(email);
    await dialog.getByLabel('Role').selectOption('engineer');
    await dialog.getByLabel('Initial password').fill(password);
    await saveScreenshot(page, 'add-user-dialog');
    await dialog.getByRole('button', { name: 'Add user' }).click();
    await dialog.waitFor({ state: 'hidden' });

    const row = page.getByRole('row', { name: new RegExp(email.replace(/\./g, '\\.')) });
    await row.waitFor();
    const roleSelect = row.getByLabel('Role of Noor Haddad');
    expect(await roleSelect.inputValue()).toBe('engineer');
    await roleSelect.selectOption('reviewer');
    await page.getByText('Noor Haddad is now Safety reviewer.').waitFor();
    await page.reload();
    expect(
      await page
        .getByRole('row', { name: new RegExp(email) })
        .getByLabel('Role of Noor Haddad')
        .inputValue(),
    ).toBe('reviewer');
    await saveScreenshot(page, 'users');

    await page.getByRole('button', { name: 'Deactivate Noor Haddad' }).click();
    const confirm = page.getByRole('dialog', { name: 'Deactivate Noor Haddad?' });
    await confirm.getByRole('button', { name: 'Deactivate' }).click();
    await page.getByText('Noor Haddad is deactivated.').waitFor();
    await page.context().close();

    // A deactivated account can no longer sign in.
    const other = await browser.open();
    await fillSignIn(other, email, password);
    await other.getByRole('alert').waitFor();
    expect(new URL(other.url()).pathname).toBe('/sign-in');
    await other.context().close();
  });

  it('shows server field errors in the dialog when the e-mail is already taken', async () => {
    const page = await browser.open();
    await signInAs(page, 'admin');
    await page.goto('/admin/users');
    await page.getByRole('button', { name: 'Add user' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a user' });
    await dialog.getByLabel('Name').fill('Second Investigator');
    await dialog.getByLabel('E-mail').fill('investigator@driftcase.example');
    await dialog.getByLabel('Initial password').fill('long-enough-secret-42');
    await dialog.getByRole('button', { name: 'Add user' }).click();
    await dialog.getByRole('alert').or(dialog.locator('[aria-invalid="true"]')).first().waitFor();
    expect(await dialog.isVisible()).toBe(true);
    await page.context().close();
  });
});
