import { execFileSync } from 'node:child_process';
import { expect, type Page } from '@playwright/test';

export const demoMaker = { email: 'demo-maker@example.com', password: 'loops-and-rounds' };
export const demoAdmin = { email: 'admin@example.com', password: 'admin-loops-and-rounds' };

let n = 0;
/**
 * Adds a member to the running e2e server's database through the admin CLI (no sign-up rate limit, no e-mail),
 * for tests that need a second person (a friend, another member).
 */
export function createMember(name = 'Test friend') {
  n += 1;
  const member = { email: `e2e-${process.pid}-${Date.now()}-${n}@example.com`, password: 'e2e-friend-password', name };
  execFileSync(process.execPath, ['--import', 'tsx', 'server/cli/create-user.ts', '--email', member.email, '--password', member.password, '--name', name], {
    env: { ...process.env, DATA_DIR: process.env.E2E_DATA_DIR! },
    stdio: 'pipe',
  });
  return member;
}

/** Signs in through the real sign-in page and waits for the home screen. */
export async function signIn(page: Page, who: { email: string; password: string } = demoMaker) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password', { exact: true }).fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'On the hook' })).toBeVisible();
}
