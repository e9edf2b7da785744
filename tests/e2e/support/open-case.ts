import type { Page } from 'playwright-core';

/** Opens a case from the case list by (part of) its title, as a person clicks it. */
export async function openCaseFromList(page: Page, title: RegExp) {
  await page.getByRole('row').filter({ hasText: title }).getByRole('link').first().click();
}
