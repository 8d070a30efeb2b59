import { expect, test as setup } from '@playwright/test';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { demoPassword, sessionFile, storedSessions, signIn } from './helpers';

// Signs each demo account a test opens at its start in once, through the real sign-in form, and
// keeps its cookies in .data/auth/: those tests start signed in (`test.use({ storageState })`)
// instead of each paying for the sign-in page. The form is posted as a browser without JavaScript
// posts it (accounts.e2e.ts checks that path): the session is the same, and neither page has a
// script to load and hydrate, which on a loaded machine took about half of each sign-in's 6–8 s.
setup.use({ javaScriptEnabled: false });

for (const { email, landsOn } of storedSessions) {
	setup(`sign ${email} in`, async ({ page }) => {
		await signIn(page, email, demoPassword);
		await expect(page).toHaveURL(landsOn);
		await mkdir(path.dirname(sessionFile(email)), { recursive: true });
		await page.context().storageState({ path: sessionFile(email) });
	});
}
