import { expect, test, type Page } from '@playwright/test';
import { signIn } from './helpers';

// Each test makes (and removes) its own project and yarn, so the demo project stays as other tests expect it.

test('a maker starts a project from the demo pattern, sees its pieces and the safety caution, then deletes it', async ({ page }) => {
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));
  const title = `Bramble for the e2e shelf ${Date.now()}`;

  await signIn(page);
  await page.getByRole('navigation', { name: 'Main' }).last().getByRole('link', { name: 'Projects' }).click();
  await expect(page.getByRole('heading', { name: 'Projects', level: 1 })).toBeVisible();
  await page.getByRole('link', { name: 'New project' }).click();

  await page.getByLabel('Start from one of your patterns').selectOption({ label: 'Bramble, the blackberry sprite' });
  await expect(page).toHaveURL(/\/projects\/new\?patternId=\d+/);
  await expect(page.getByLabel('Title')).toHaveValue('Bramble, the blackberry sprite');
  // The pieces the project will copy, and the caution for the pattern's safety eyes, before anything is saved.
  await expect(page.getByText('17 rounds · 3.5 mm (US E-4)')).toBeVisible();
  await expect(page.getByText('Small parts can be a choking hazard')).toBeVisible();
  await page.getByLabel('Title').fill(title);
  await page.getByLabel(/Who is it for/).fill('the e2e run');
  await page.getByRole('button', { name: 'Start the project' }).click();

  await expect(page.getByRole('heading', { name: title, level: 1 })).toBeVisible();
  await expect(page).toHaveURL(/\/projects\/\d+$/);
  const projectUrl = page.url();
  for (const piece of ['Body', 'Leaf', 'Stalk']) await expect(page.getByRole('heading', { name: piece, level: 3 })).toBeVisible();
  await expect(page.getByText('Not started · 17 rounds')).toBeVisible();
  await expect(page.getByRole('link', { name: 'Count Body' })).toHaveAttribute('href', /\/projects\/\d+\/pieces\/\d+\/count$/);
  const caution = page.getByRole('alert').filter({ hasText: 'Small parts can be a choking hazard' });
  await expect(caution).toBeVisible();
  await expect(caution).toContainText('16 CFR 1501');
  // The Body's silhouette is open, with the pattern's eye placement marked on it.
  await expect(page.getByRole('img', { name: /Body silhouette/ })).toBeVisible();

  // "For a child under 3" adds its own caution.
  await page.getByRole('button', { name: 'Edit details' }).click();
  await page.getByLabel('For a child under 3').check();
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'Made for a child under 3' })).toBeVisible();

  await page.getByLabel('Status').selectOption('resting');
  await expect(page.locator('header').getByText('Resting')).toBeVisible();
  await page.reload();
  await expect(page.getByLabel('Status')).toHaveValue('resting');

  await page.goto('/projects?status=resting');
  await expect(page.getByRole('button', { name: 'Resting' })).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByRole('link', { name: new RegExp(title) })).toBeVisible();
  await expect(page.getByText('Bramble for the window sill')).toHaveCount(0);

  await page.goto(projectUrl);
  await page.getByRole('button', { name: 'Delete this project' }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Delete the project' }).click();
  await expect(page).toHaveURL(/\/projects$/);
  await expect(page.getByText(title)).toHaveCount(0);
  await expect(page.getByText('Bramble for the window sill')).toBeVisible();
  expect(consoleErrors).toEqual([]);
});

// The phone layout shows one card per yarn in the "Yarns" list.
const shelfCard = (page: Page, name: string) => page.getByRole('list', { name: 'Yarns' }).getByRole('listitem').filter({ hasText: name });

test('a yarn picked from the shelf for a project counts off what is left', async ({ page }) => {
  const yarn = `Sea cotton ${Date.now()}`;
  await signIn(page);
  await page.goto('/yarns');
  await page.getByRole('button', { name: /Add (a|your first) yarn/ }).first().click();
  await page.getByLabel('Name').fill(yarn);
  await page.getByLabel('Meters per skein').fill('100');
  await page.getByLabel('Skeins owned').fill('2');
  await page.getByRole('button', { name: 'Add to the shelf' }).click();
  const card = shelfCard(page, yarn);
  await expect(card).toContainText('200 m · 219 yd');

  // A project of our own, made through the API with the signed-in cookies.
  const res = await page.request.post('/api/projects', { data: { title: `Yarn test ${Date.now()}` } });
  expect(res.status()).toBe(201);
  const { project } = await res.json();
  await page.goto(`/projects/${project.id}`);
  await page.getByRole('button', { name: 'Edit materials' }).click();
  await page.getByLabel('Add from your yarn shelf').selectOption({ label: `${yarn} (200 m left)` });
  await page.getByLabel('Meters used').fill('60');
  await page.getByRole('button', { name: 'Save materials' }).click();
  await expect(page.getByText('60 m used')).toBeVisible();
  await expect(page.getByText('from your shelf')).toBeVisible();

  await page.goto('/yarns');
  // 200 m − 60 m = 140 m; 140 ÷ 0.9144 ≈ 153 yd.
  await expect(shelfCard(page, yarn)).toContainText('140 m · 153 yd');

  await shelfCard(page, yarn).getByRole('button', { name: `Delete ${yarn}` }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Delete the yarn' }).click();
  await expect(shelfCard(page, yarn)).toHaveCount(0);
  expect((await page.request.delete(`/api/projects/${project.id}`)).status()).toBe(204);
});

test('on a phone, a maker edits a counted piece: the round table checks as they type, the count moves with its round', async ({ page }) => {
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));
  await signIn(page);
  // A project of our own with one piece, counted into its third round through the Tally's API.
  const created = await page.request.post('/api/projects', {
    data: { title: `Bobble edit ${Date.now()}`, pieces: [{ name: 'Bobble', instructions: 'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, inc) x6 (18)' }] },
  });
  expect(created.status()).toBe(201);
  const { project } = await created.json();
  const pieceId = project.pieces[0].id;
  const set = await page.request.post(`/api/pieces/${pieceId}/progress`, { data: { opId: `e2e-${Date.now()}-edit`, action: 'set', to: { copy: 1, round: 2, step: 0 } } });
  expect(set.status()).toBe(200);

  await page.goto(`/projects/${project.id}`);
  await expect(page.getByText('Rnd 3 of 3')).toBeVisible();
  await page.getByRole('button', { name: 'Edit Bobble' }).click();
  const form = page.getByRole('form', { name: 'Edit Bobble' });
  const text = form.getByRole('textbox', { name: /Instructions/ });
  // A plain round added after Rnd 1, with a slip in its stated count, and a new last round.
  const edited = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: sc around (7)', 'Rnd 3: inc x6 (12)', 'Rnd 4: (sc, inc) x6 (18)', 'Rnd 5: (2 sc, inc) x6 (24)'].join('\n');
  await text.fill(edited);
  const table = form.getByRole('region', { name: 'Round table' });
  await expect(table.getByText('Round 2 makes 6 stitches, not 7')).toBeVisible();
  await expect(table.getByText('1 to check')).toBeVisible();
  await text.fill(edited.replace('(7)', '(6)'));
  await expect(table.getByText('Every count adds up')).toBeVisible();
  await expect(form.getByText('5 rounds to count')).toBeVisible();
  // The count was on Rnd 3; that round is Rnd 4 now, and the new Rnd 2 counts as worked. Said before saving.
  const warning = form.getByRole('alert').filter({ hasText: 'What this does to your Tally count' });
  await expect(warning).toContainText('Rnd 2 is new and comes before your place');
  await expect(warning).toContainText('after saving it stands at the start of Rnd 4');

  await form.getByRole('button', { name: 'Save and move the count' }).click();
  await expect(form).toHaveCount(0);
  await expect(page.getByText('Rnd 4 of 5')).toBeVisible();
  await page.reload();
  await expect(page.getByText('Rnd 4 of 5')).toBeVisible();
  const progress = await (await page.request.get(`/api/pieces/${pieceId}/progress`)).json();
  expect(progress.progress).toMatchObject({ copy: 1, round: 3, step: 0 });

  expect((await page.request.delete(`/api/projects/${project.id}`)).status()).toBe(204);
  expect(consoleErrors).toEqual([]);
});
