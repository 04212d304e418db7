import { expect, test } from '@playwright/test';
import { signIn } from './helpers';

test('a maker types a pattern with a mistake, sees it at its line, fixes it, saves and starts a project', async ({
  page,
}) => {
  const consoleErrors: string[] = [];
  page.on(
    'console',
    (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()),
  );
  await signIn(page);

  await page.getByRole('navigation', { name: 'Main' }).last().getByRole('link', { name: 'Patterns' }).click();
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await page.getByRole('link', { name: 'New pattern' }).click();
  await expect(page.getByRole('heading', { name: 'New pattern' })).toBeVisible();

  const title = `Acorn cap ${Date.now()}`;
  await page.getByLabel('Title').fill(title);
  await page.getByLabel('Piece name').fill('Cap');
  await page.getByLabel('Hook (mm)').first().fill('3.5');
  // Source: Craft Yarn Council hook chart — 3.5 mm is US E-4.
  await expect(page.getByTestId('hook-label')).toHaveText('3.5 mm (US E-4)');

  const instructions = page.getByLabel(/^Instructions \(/);
  await instructions.fill('Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\n');
  // The last line typed key by key: the round table follows as it is typed.
  await instructions.pressSequentially('Rnd 3: (sc, inc) x6 (20)');

  const table = page.getByRole('region', { name: 'Round table' });
  const r3 = table.getByRole('row', { name: 'Rnd 3, check' });
  await expect(r3).toBeVisible();
  await expect(r3).toContainText('18');
  await expect(r3).toContainText('check');
  const problem = table.getByRole('button', { name: /line 3/ });
  await expect(problem).toContainText('18');
  await expect(table.getByRole('row', { name: 'Rnd 2' })).toBeVisible();

  // Clicking the problem puts the caret on line 3 of the instructions.
  await problem.click();
  await expect(instructions).toBeFocused();
  const caretLine = await instructions.evaluate(
    (el: HTMLTextAreaElement) => el.value.slice(0, el.selectionStart).split('\n').length,
  );
  expect(caretLine).toBe(3);

  // Fix the stated count right there.
  await page.keyboard.press('End');
  for (let i = 0; i < 3; i++) await page.keyboard.press('Backspace');
  await page.keyboard.type('18)');
  await expect(table.getByText('Every count adds up')).toBeVisible();
  await expect(table.getByRole('row', { name: 'Rnd 3' })).toBeVisible();
  await expect(page.getByText(/^Estimate:/)).toBeVisible();

  await page.getByRole('button', { name: 'Save pattern' }).click();
  await expect(page).toHaveURL(/\/patterns\/\d+$/);
  await expect(page.getByRole('heading', { name: title })).toBeVisible();
  const patternId = new URL(page.url()).pathname.split('/').pop();
  await expect(page.getByLabel(/^Instructions \(/)).toHaveValue(
    'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, inc) x6 (18)',
  );

  // The server checked it again on save: no problems in the list.
  const list = await page.request.get('/api/patterns');
  const mine = (await list.json()).patterns.find((p: { title: string }) => p.title === title);
  expect(mine).toMatchObject({ pieceCount: 1, problemCount: 0 });

  await page.getByRole('link', { name: 'Start a project from this pattern' }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/new\\?patternId=${patternId}$`));
  expect(consoleErrors).toEqual([]);
});

test('the US/UK toggle shows converted text and leaves the typed text alone', async ({ page }) => {
  await signIn(page);
  await page.goto('/patterns/new');
  const instructions = page.getByLabel(/^Instructions \(/);
  await instructions.fill('Rnd 1: 6 sc in MR (6)\nRnd 2: (hdc, inc) x3 (9)');
  await page.getByRole('radio', { name: 'UK terms' }).click();
  // Source: US sc = UK dc, US hdc = UK htr (standards.md §4, US/UK terms).
  await expect(page.getByLabel('Instructions in UK terms (read-only)')).toContainText(
    'Rnd 2: (htr, inc) x3 (9)',
  );
  await expect(instructions).toBeHidden();
  await page.getByRole('radio', { name: /US terms/ }).click();
  await expect(instructions).toHaveValue('Rnd 1: 6 sc in MR (6)\nRnd 2: (hdc, inc) x3 (9)');
});
