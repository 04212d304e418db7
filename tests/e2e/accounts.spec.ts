import { expect, test, type Page } from '@playwright/test';
import { createMember, demoAdmin, signIn } from './helpers';

// The whole account path a new maker takes, through the real server and its built-in mail fake (real SMTP on
// 127.0.0.1): sign up → confirm from the outbox → sign out → forgot password → reset from the outbox → sign in.
// Guidance followed by the flows under test: OWASP Authentication and Forgot Password cheat sheets (one answer
// whether or not an account exists, single-use expiring tokens, no automatic sign-in after a reset) and
// NIST SP 800-63B §5.1.1 for password length.

/** Opens the outbox page and follows the newest link of the message to `to` whose subject matches. */
async function openMailedLink(page: Page, to: string, subject: RegExp, path: string) {
  await page.goto('/dev/outbox');
  await expect(page.getByRole('heading', { name: 'Outbox', level: 1 })).toBeVisible();
  const message = page.getByRole('listitem').filter({ hasText: to }).filter({ has: page.getByRole('heading', { name: subject }) }).first();
  // The page refreshes itself every few seconds; mail sent after an answer (the reset) may take a moment.
  const link = message.getByRole('link', { name: new RegExp(`${path.replace('/', '\\/')}\\?token=`) });
  await expect(link).toBeVisible({ timeout: 15_000 });
  await link.click();
}

test('sign up, confirm the e-mail from the outbox, forget the password and reset it from the outbox', async ({ page }) => {
  const consoleErrors: string[] = [];
  // The browser logs expected 401s (signed-out /me) and the 400 of nothing else; anything else is a bug.
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));
  const email = `e2e-accounts-${Date.now()}@example.com`;
  const first = 'first long passphrase';
  const second = 'second long passphrase';

  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'New here? Make an account' }).click();
  await expect(page.getByRole('heading', { name: 'Make your Whorlbook account' })).toBeVisible();
  await page.getByLabel('Your name').fill('Juniper Test');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(first);
  await page.getByRole('button', { name: 'Make my account' }).click();

  await expect(page.getByRole('heading', { name: 'On the hook' })).toBeVisible();
  await expect(page.getByText('Please confirm your e-mail')).toBeVisible();

  await openMailedLink(page, email, /Confirm your e-mail/, '/verify-email');
  await expect(page.getByText('E-mail confirmed')).toBeVisible();
  await page.getByRole('link', { name: 'Go to On the hook' }).click();
  await expect(page.getByRole('heading', { name: 'On the hook' })).toBeVisible();
  await expect(page.getByText('Please confirm your e-mail')).toHaveCount(0);

  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Welcome back' })).toBeVisible();

  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send me a reset link' }).click();
  await expect(page.getByText(/If an account uses that e-mail address/)).toBeVisible();
  await expect(page.getByRole('link', { name: 'Open the outbox' })).toBeVisible();

  await openMailedLink(page, email, /Choose a new Whorlbook password/, '/reset-password');
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await page.getByLabel('New password').fill(second);
  await page.getByRole('button', { name: 'Save my new password' }).click();
  await expect(page.getByText('Password changed')).toBeVisible();
  await page.getByRole('link', { name: 'Sign in' }).click();

  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(second);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'On the hook' })).toBeVisible();
  await expect(page.getByText('Hello, Juniper Test.', { exact: false })).toBeVisible();

  // The reset link was single-use: opening it again says so.
  await page.goto('/dev/outbox');
  await openMailedLink(page, email, /Choose a new Whorlbook password/, '/reset-password');
  await page.getByLabel('New password').fill('third long passphrase');
  await page.getByRole('button', { name: 'Save my new password' }).click();
  await expect(page.getByText(/already used/)).toBeVisible();

  expect(consoleErrors.filter((e) => !/status of 400/.test(e))).toEqual([]);
});

test('every form on the account screens keeps its tap targets at least 48 px on a 390 px phone', async ({ page }) => {
  for (const path of ['/sign-up', '/forgot-password', '/reset-password?token=Abc_def-123456789012345678901234567890123']) {
    await page.goto(path);
    await expect(page.getByRole('button').first()).toBeVisible();
    const small = await page.evaluate(() =>
      [...document.querySelectorAll('main button, main input:not([type=hidden]), main a, main select')]
        // A checkbox is tapped through its whole label.
        .map((el) => (el instanceof HTMLInputElement && el.type === 'checkbox' ? el.closest('label')! : el))
        .map((el) => ({ el: (el as HTMLElement).outerHTML.slice(0, 80), h: el.getBoundingClientRect().height }))
        .filter((x) => x.h < 48),
    );
    expect(small, `${path}: targets under 48 px`).toEqual([]);
  }
});

test('an admin disables a member from the members table and that member is signed out at once', async ({ page, browser }) => {
  const member = createMember('Sorrel To Disable');
  const memberContext = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const memberPage = await memberContext.newPage();
  try {
    await signIn(memberPage, member);

    await signIn(page, demoAdmin);
    await page.getByRole('link', { name: 'Admin' }).click();
    await expect(page.getByRole('heading', { name: 'Members' })).toBeVisible();
    await page.getByLabel('Find a member').fill(member.email);
    const row = page.getByRole('row').filter({ hasText: member.email });
    await expect(row).toHaveCount(1);
    await expect(row.getByText('Active')).toBeVisible();
    await row.getByRole('button', { name: 'Disable Sorrel To Disable' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Disable member' }).click();
    await expect(row.getByText('Disabled')).toBeVisible();

    // The member's next page load finds no session, and signing in is refused.
    await memberPage.reload();
    await expect(memberPage.getByRole('heading', { name: 'Welcome back' })).toBeVisible();
    await memberPage.getByLabel('E-mail').fill(member.email);
    await memberPage.getByLabel('Password', { exact: true }).fill(member.password);
    await memberPage.getByRole('button', { name: 'Sign in' }).click();
    await expect(memberPage.getByText(/has been disabled/)).toBeVisible();

    await row.getByRole('button', { name: 'Re-enable Sorrel To Disable' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Re-enable member' }).click();
    await expect(row.getByText('Active')).toBeVisible();
  } finally {
    await memberContext.close();
  }
});

test('change the sign-in e-mail through the link in the outbox, then delete the account', async ({ page }) => {
  const member = createMember('Moving maker');
  const moved = `e2e-moved-${Date.now()}@example.com`;
  await signIn(page, member);
  await page.goto('/account');
  await page.getByLabel('New e-mail').fill(moved);
  await page.getByLabel('Password', { exact: true }).fill(member.password);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByText(`We sent a link to ${moved}.`, { exact: false })).toBeVisible();
  // Nothing changes until the link is opened.
  await expect(page.getByText(member.email)).toBeVisible();

  await openMailedLink(page, moved, /Confirm your new e-mail/, '/change-email');
  await expect(page.getByText(`Done: you now sign in with ${moved}.`)).toBeVisible();
  await page.getByRole('link', { name: 'Go to Me' }).click();
  await expect(page.getByText(moved)).toBeVisible();

  // Leaving: the password, one more question, then the sign-in page; the account no longer signs in.
  await page.getByLabel('Your password').fill(member.password);
  await page.getByRole('button', { name: 'Delete my account' }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Delete everything' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(moved);
  await page.getByLabel('Password', { exact: true }).fill(member.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert').first()).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});
