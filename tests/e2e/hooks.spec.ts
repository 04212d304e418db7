import { expect, test } from '@playwright/test';
import { createMember, signIn } from './helpers';

// A member of its own, so the demo maker's hook roll stays empty for the other specs.

test('a maker adds a hook to the hook roll, sees its US size, and the project page says which pieces need a hook they lack', async ({ page }) => {
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));
  const maker = createMember('Hook roll maker');
  await signIn(page, maker);

  await page.getByRole('navigation', { name: 'Main' }).last().getByRole('link', { name: 'Projects' }).click();
  await page.getByRole('link', { name: /Hook roll/ }).click();
  await expect(page.getByRole('heading', { name: 'Hook roll', level: 1 })).toBeVisible();
  await expect(page.getByText('Your hook roll is empty')).toBeVisible();

  await page.getByRole('button', { name: 'Add your first hook' }).click();
  await page.getByLabel('Size (mm)').fill('3.5');
  // Source: Craft Yarn Council hook chart (standards.md §2, S9/S10/S13): 3.5 mm is US E-4.
  await expect(page.getByText('Shown as 3.5 mm (US E-4).')).toBeVisible();
  await page.getByLabel('Material').selectOption({ label: 'Aluminium' });
  await page.getByRole('button', { name: 'Add to the roll' }).click();
  const hooks = page.getByRole('list', { name: 'Hooks' });
  await expect(hooks.getByRole('listitem')).toHaveCount(1);
  await expect(hooks.getByRole('listitem').first()).toContainText('3.5 mm (US E-4)');
  await expect(hooks.getByRole('listitem').first()).toContainText('Aluminium');

  // A project of the member's own with a piece on the hook they have and one on a hook they do not.
  const created = await page.request.post('/api/projects', {
    data: {
      title: `Pocket hedgehog ${Date.now()}`,
      pieces: [
        { name: 'Body', hookMm: 3.5, instructions: 'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)' },
        { name: 'Snout', hookMm: 2.75, instructions: 'Rnd 1: 4 sc in MR (4)' },
      ],
    },
  });
  expect(created.status()).toBe(201);
  const { project } = await created.json();
  await page.goto(`/projects/${project.id}`);

  const piece = (name: string) => page.getByRole('listitem').filter({ has: page.getByRole('heading', { name, level: 3 }) });
  await expect(piece('Body').getByTestId('hook-roll-check')).toHaveText('In your hook roll · 3.5 mm (US E-4)');
  // Source: Craft Yarn Council hook chart (standards.md §2, S9/S10/S13): 2.75 mm is US C-2.
  await expect(piece('Snout').getByTestId('hook-roll-check')).toContainText('Not in your hook roll — 2.75 mm (US C-2)');

  // From the piece straight to the roll, at the size it needs.
  await piece('Snout').getByRole('link', { name: 'Add a 2.75 mm (US C-2) hook to your hook roll' }).click();
  await expect(page.getByLabel('Size (mm)')).toHaveValue('2.75');
  await page.getByRole('button', { name: 'Add to the roll' }).click();
  await expect(hooks.getByRole('listitem')).toHaveCount(2);
  await expect(hooks.getByRole('listitem').first()).toContainText('2.75 mm (US C-2)');

  await page.goto(`/projects/${project.id}`);
  await expect(piece('Snout').getByTestId('hook-roll-check')).toHaveText('In your hook roll · 2.75 mm (US C-2)');

  // Delete asks first.
  await page.goto('/hooks');
  await page.getByRole('button', { name: 'Delete 2.75 mm (US C-2)' }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog).toContainText('Take the 2.75 mm (US C-2) hook out of the roll?');
  await dialog.getByRole('button', { name: 'Delete the hook' }).click();
  await expect(hooks.getByRole('listitem')).toHaveCount(1);

  expect((await page.request.delete(`/api/projects/${project.id}`)).status()).toBe(204);
  expect(consoleErrors).toEqual([]);
});
