import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DESKTOP, saveScreenshot, useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

/**
 * RFC 7638 §3 thumbprint of an Ed25519 public key, computed here independently of the server: the
 * SHA-256 of the required members in lexicographic order without whitespace (for OKP keys `crv`,
 * `kty`, `x`, RFC 8037 §2), base64url-encoded without padding (RFC 7515 §2).
 */
function rfc7638Thumbprint(jwk: { crv: string; kty: string; x: string }): string {
  const canonical = `{"crv":"${jwk.crv}","kty":"${jwk.kty}","x":"${jwk.x}"}`;
  return createHash('sha256').update(canonical).digest('base64url');
}

describe('the keys and evidence page', () => {
  const browser = useBrowser();

  it("shows the signing key's thumbprint, rotates it after a confirmation and keeps the old one listed", async () => {
    const page = await browser.open({ viewport: DESKTOP });
    await signInAs(page, 'admin');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Keys and evidence' })
      .click();
    await page.getByRole('heading', { name: 'Keys and evidence' }).waitFor();
    const current = page.getByTestId('current-thumbprint');
    await current.waitFor();
    const before = ((await current.textContent()) ?? '').trim();

    // The published keys, as anyone checking an archive fetches them.
    const jwks = (await page.evaluate(async () => (await fetch('/api/keys')).json())) as {
      keys: { kid: string; crv: string; kty: string; x: string }[];
    };
    const published = jwks.keys.map(rfc7638Thumbprint);
    expect(published).toContain(before);

    // The orphan panel answers (a fresh server's store is fully accounted for) and offers no deletion.
    const orphans = page.getByRole('region', { name: 'Originals without a record' });
    await orphans
      .getByText(/Every stored file is accounted for|Stored originals no bundle names|Unfinished uploads/)
      .first()
      .waitFor();
    expect(await orphans.getByRole('button', { name: /delete|remove/i }).count()).toBe(0);
    await saveScreenshot(page, 'keys-and-evidence');

    await page.getByRole('button', { name: 'Rotate signing key' }).click();
    const dialog = page.getByRole('dialog', { name: 'Rotate the signing key?' });
    await dialog.waitFor();
    expect(await dialog.textContent()).toContain('archives it signed stay verifiable');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });
    expect(((await current.textContent()) ?? '').trim()).toBe(before);

    await page.getByRole('button', { name: 'Rotate signing key' }).click();
    await dialog.getByRole('button', { name: 'Rotate signing key' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page.getByText(/A new key signs from now on/).waitFor();
    const after = ((await current.textContent()) ?? '').trim();
    expect(after).not.toBe(before);
    const retired = page.getByRole('table').filter({ hasText: 'Retired' });
    expect(await retired.textContent()).toContain(before);

    const republished = (await page.evaluate(async () => (await fetch('/api/keys')).json())) as typeof jwks;
    const thumbprints = republished.keys.map(rfc7638Thumbprint);
    expect(thumbprints).toContain(after);
    // The retired key is still published, so archives it signed still verify.
    expect(thumbprints).toContain(before);
    await saveScreenshot(page, 'keys-rotated');
    await page.context().close();
  }, 180_000);
});
