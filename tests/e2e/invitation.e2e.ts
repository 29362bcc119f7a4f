import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, navLabels, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

describe('invitation by e-mail, end to end', () => {
  it('admin invites; the link read from Sent mail makes a working engineer account', async () => {
    const admin = await newPage(h);
    let link: string;
    try {
      await signIn(admin.page, h.url, 'admin@brannock.example');
      await admin.page.getByRole('link', { name: 'Members' }).click();
      await admin.page.getByLabel('E-mail').fill('surveyor@brannock.example');
      await admin.page.getByLabel('Role', { exact: true }).selectOption('engineer');
      await admin.page.getByRole('button', { name: 'Send invitation' }).click();
      await admin.page.getByText('Invitation sent to surveyor@brannock.example').waitFor();
      await admin.page.getByText('surveyor@brannock.example · engineer').waitFor();

      await admin.page.getByRole('link', { name: 'Sent mail' }).click();
      await admin.page.getByText('You are invited to Brannock County on Wearcourse').click();
      const body = await admin.page.getByTestId('mail-body').textContent();
      link = body!.match(/https?:\/\/\S+\/invite\/\S+/)![0];
      expect(link.startsWith(h.url)).toBe(true);
    } finally {
      await admin.context.close();
    }

    const invitee = await newPage(h);
    try {
      await invitee.page.goto(link);
      await invitee.page.getByRole('heading', { name: 'Join Brannock County' }).waitFor();
      await invitee.page.getByLabel('Your name').fill('Sam Surveyor');
      await invitee.page.getByLabel('Choose a password').fill('gravel and chip seal');
      await invitee.page.getByRole('button', { name: 'Accept and join' }).click();
      await invitee.page.waitForURL(/\/a\/[^/]+\/network/);
      expect(await invitee.page.getByTestId('role').textContent()).toBe('engineer');
      expect(await navLabels(invitee.page)).toContain('Imports');
      // Sign out and back in with the new password.
      await invitee.page.getByRole('button', { name: 'Sign out' }).click();
      await invitee.page.waitForURL(/\/sign-in/);
      await signIn(invitee.page, h.url, 'surveyor@brannock.example', 'gravel and chip seal');
      expect(invitee.outside).toEqual([]);
    } finally {
      await invitee.context.close();
    }
  });
});
