import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

/** Form controls with no accessible name: no `<label>`, `aria-label` or `aria-labelledby`. */
function findUnlabelledControls(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(document.querySelectorAll<HTMLElement>('input, select, textarea, button'))
      .filter((element) => {
        const control = element as HTMLInputElement;
        const hasLabel = (control.labels?.length ?? 0) > 0;
        const hasAria = element.getAttribute('aria-label') || element.getAttribute('aria-labelledby');
        const hasText = element.tagName === 'BUTTON' && (element.textContent ?? '').trim().length > 0;
        return !hasLabel && !hasAria && !hasText;
      })
      .map((element) => element.outerHTML.slice(0, 120)),
  );
}

describe('accessibility basics', () => {
  const browser = useBrowser();

  it('every control on the main pages has a label', async () => {
    const page = await browser.open();
    await signInAs(page, 'admin');
    for (const [path, ready] of [
      ['/cases', 'Cases'],
      ['/cases/new', 'New case'],
      ['/admin/users', 'Users'],
    ] as const) {
      await page.goto(path);
      await page.getByRole('heading', { name: ready, exact: true }).waitFor();
      await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'));
      expect(await findUnlabelledControls(page), path).toEqual([]);
    }
    await page.context().close();
  });

  it('the first Tab reaches a visible skip link that moves focus to the content', async () => {
    const page = await browser.open();
    await signInAs(page, 'reviewer');
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => {
      const element = document.activeElement as HTMLElement;
      const style = getComputedStyle(element);
      const box = element.getBoundingClientRect();
      return { text: element.textContent, outline: style.outlineStyle, width: box.width };
    });
    expect(focused.text).toBe('Skip to content');
    // WCAG 2.2, success criterion 2.4.7 Focus Visible: the focused control shows an indicator.
    expect(focused.outline).not.toBe('none');
    expect(focused.width).toBeGreaterThan(1);
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
    await page.context().close();
  });

  it('answers repeated failed sign-ins with the wait message', async () => {
    const page = await browser.open();
    const email = 'nobody-here@driftcase.example';
    // The server locks an address and e-mail pair after ten failures in fifteen minutes.
    for (let attempt = 0; attempt < 10; attempt += 1) {
      await page.request.post('/api/auth/login', { data: { email, password: 'not-the-password' } });
    }
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Too many attempts, wait a minute.').waitFor();
    await page.context().close();
  });
});
