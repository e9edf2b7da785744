import { describe, expect, it } from 'vitest';
import { csrfHeaders } from './support/api-session';
import { useBrowser } from './support/browser';
import { signInAs } from './support/sign-in';

describe('people on a case', () => {
  const browser = useBrowser();

  it('the creator adds an engineer with the keyboard, who can then see the evidence; before that they are told whom to ask', async () => {
    const investigator = await browser.open();
    await signInAs(investigator, 'investigator');
    const created = await investigator.request.post('/api/cases', {
      headers: await csrfHeaders(investigator),
      data: {
        title: `Membership check ${Date.now() % 100_000}`,
        site: 'Harbourline Cold Store, Dock Hall B',
        robotId: 'AMR-02',
        incidentTime: '2026-11-23T09:00:00Z',
        severity: 'low',
      },
    });
    expect(created.status()).toBe(201);
    const caseId = (await created.json()).id as string;

    // The engineer is not on the case yet: the page says so and the evidence is refused.
    const engineer = await browser.open();
    await signInAs(engineer, 'engineer');
    await engineer.goto(`/cases/${caseId}`);
    const engineerPanel = engineer.getByRole('region', { name: 'People on this case' });
    await engineerPanel.getByText('You are not on this case').waitFor();
    expect((await engineer.request.get(`/api/cases/${caseId}/bundles`)).status()).toBe(403);

    await investigator.goto(`/cases/${caseId}`);
    const panel = investigator.getByRole('region', { name: 'People on this case' });
    await panel.getByText('No one besides its creator works on this case yet.').waitFor();
    const role = panel.getByLabel('Part on the case');
    await role.focus();
    await role.selectOption('engineer');
    await panel
      .getByLabel('Person')
      .locator('option', { hasText: 'Emeka Lindqvist' })
      .waitFor({ state: 'attached' });
    await panel.getByRole('button', { name: 'Add to case' }).focus();
    await investigator.keyboard.press('Enter');
    await panel.getByRole('listitem').filter({ hasText: 'Emeka Lindqvist' }).waitFor();
    await panel.getByRole('button', { name: 'Remove Emeka Lindqvist from this case' }).waitFor();

    expect((await engineer.request.get(`/api/cases/${caseId}/bundles`)).status()).toBe(200);
    await engineer.reload();
    await engineerPanel.getByRole('listitem').filter({ hasText: 'Emeka Lindqvist' }).waitFor();
    expect(await engineerPanel.getByText('You are not on this case').count()).toBe(0);
    await investigator.context().close();
    await engineer.context().close();
  });
});
