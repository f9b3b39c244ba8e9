/**
 * Nothing lost across tabs, links and replacements, in Chromium: two tabs keep their own work and
 * hear each other's saves; a save over another tab's newer save, or over a plan deleted in another
 * tab, asks first; a link, a plan file or the demo keeps the open plan as a named copy first and
 * says where; an autosave of a newer format version is named as newer and never overwritten; a
 * crafted link that unpacks past the size cap is refused at once as too large.
 */
import lzString from 'lz-string';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const TIMELINE = '[data-chart="planner-timeline"]';

guardEveryPage();

async function openPlanner(page: Page, url = './') {
  await page.goto(url);
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  await expect(page.getByRole('textbox', { name: 'Plan name' })).toBeVisible();
  await expect(page.locator(TIMELINE)).toHaveAttribute('data-drawn', 'true');
}

async function rename(page: Page, name: string) {
  const field = page.getByRole('textbox', { name: 'Plan name' });
  await field.fill(name);
  await field.press('Tab');
}

/** Waits until the autosave (debounced) has written `name` in some slot of this browser. */
async function autosaved(page: Page, name: string) {
  await expect
    .poll(() =>
      page.evaluate((n) => Object.keys(localStorage).some((k) => k.startsWith('sekundo.autosave') && (localStorage.getItem(k) ?? '').includes(JSON.stringify(n).slice(1, -1))), name),
    )
    .toBe(true);
}

async function savedPlansPanel(page: Page) {
  const toggle = page.getByRole('button', { name: /^Saved plans \(/ });
  if ((await toggle.getAttribute('aria-expanded')) !== 'true') await toggle.click();
}

test.describe('tabs', () => {
  test('two tabs keep their own work: a reload of each brings back its own plan', async ({ page, context }) => {
    await openPlanner(page);
    await rename(page, 'Tab A: bolometer spacing');
    await autosaved(page, 'Tab A: bolometer spacing');
    const other = await context.newPage();
    await openPlanner(other);
    // A new tab starts from the newest work of this browser…
    await expect(other.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Tab A: bolometer spacing');
    // …and from then on keeps its own.
    await rename(other, 'Tab B: echo study');
    await autosaved(other, 'Tab B: echo study');
    await page.reload();
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Tab A: bolometer spacing');
    await other.reload();
    await other.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(other.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Tab B: echo study');
    await other.close();
  });

  test('saved plans: the other tab hears a save, and a save over a newer or deleted one asks first', async ({ page, context }) => {
    await openPlanner(page);
    await rename(page, 'Shared cooldown plan');
    await savedPlansPanel(page);
    await page.getByRole('button', { name: 'Save as new' }).click();
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Shared cooldown plan');

    const other = await context.newPage();
    await openPlanner(other);
    await savedPlansPanel(other);
    await other.getByRole('button', { name: 'Open “Shared cooldown plan”' }).click();

    // Tab A saves again; tab B hears it (its list shows the new time) without a reload.
    await rename(page, 'Shared cooldown plan');
    await page.getByRole('button', { name: 'Save over “Shared cooldown plan”' }).click();
    const savedAt = await page.evaluate(() => {
      const key = Object.keys(localStorage).find((k) => k.startsWith('sekundo.plan.')) ?? '';
      return (JSON.parse(localStorage.getItem(key) ?? '{}') as { savedAt?: string }).savedAt ?? '';
    });
    expect(savedAt).not.toBe('');

    // Tab B edits and saves over: A's newer save would be lost, so B is asked.
    await rename(other, 'Shared cooldown plan, B edits');
    await other.getByRole('button', { name: 'Save over “Shared cooldown plan”' }).click();
    const question = other.getByRole('alertdialog', { name: '“Shared cooldown plan” changed in another tab' });
    await expect(question).toBeVisible();
    await question.getByRole('button', { name: 'Save mine as a new plan' }).click();
    await expect(other.getByRole('list', { name: 'Saved plans' })).toContainText('Shared cooldown plan (this tab)');
    // A's save is untouched.
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Shared cooldown plan (this tab)');
    const listA = page.getByRole('list', { name: 'Saved plans' });
    await expect(listA.getByRole('button', { name: 'Open “Shared cooldown plan”' })).toBeVisible();

    // A deletes the plan; B's list drops it, and a save over it asks instead of bringing it back silently.
    await other.getByRole('button', { name: 'Open “Shared cooldown plan”' }).click();
    await page.getByRole('button', { name: 'Delete “Shared cooldown plan”' }).click();
    await expect(other.getByRole('button', { name: 'Open “Shared cooldown plan”' })).toHaveCount(0);
    await expect(other.getByRole('button', { name: 'Save over “Shared cooldown plan”' })).toHaveCount(0);
    await other.close();
  });

  test('a duplicated tab keeps its own work and hears the other tab', async ({ page, context }) => {
    test.setTimeout(180_000);
    await openPlanner(page);
    await rename(page, 'Original tab: 25 mm spacing');
    await autosaved(page, 'Original tab: 25 mm spacing');
    // Chromium's "Duplicate" copies the tab's sessionStorage (this tab's autosave slot with it) into
    // the new tab before its page loads; here the copy is made by an init script, once (a reload of
    // the duplicate keeps what the duplicate wrote since).
    const session = await page.evaluate(() => Object.fromEntries(Object.entries(sessionStorage)));
    expect(session['sekundo.tab-slot']).toBeTruthy();
    const duplicate = await context.newPage();
    await duplicate.addInitScript((copy) => {
      if (sessionStorage.getItem('test.duplicated') !== null) return;
      for (const [key, value] of Object.entries(copy)) sessionStorage.setItem(key, value);
      sessionStorage.setItem('test.duplicated', 'yes');
    }, session);
    await openPlanner(duplicate);
    // The duplicate opens with the same work, then takes a slot of its own.
    await expect(duplicate.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Original tab: 25 mm spacing');
    await expect.poll(() => duplicate.evaluate(() => sessionStorage.getItem('sekundo.tab-slot'))).not.toBe(session['sekundo.tab-slot']);

    // Each edits: neither overwrites the other, whichever writes last.
    await rename(duplicate, 'Duplicate tab: 40 mm spacing');
    await autosaved(duplicate, 'Duplicate tab: 40 mm spacing');
    await rename(page, 'Original tab: 30 mm spacing');
    await autosaved(page, 'Original tab: 30 mm spacing');
    await rename(duplicate, 'Duplicate tab: 45 mm spacing');
    await autosaved(duplicate, 'Duplicate tab: 45 mm spacing');
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Original tab: 30 mm spacing');

    // Each hears the other: a plan saved in the duplicate is listed in the original without a reload.
    await savedPlansPanel(duplicate);
    await duplicate.getByRole('button', { name: 'Save as new' }).click();
    await savedPlansPanel(page);
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Duplicate tab: 45 mm spacing');

    // A reload of each brings back its own plan.
    await page.reload();
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Original tab: 30 mm spacing');
    await duplicate.reload();
    await duplicate.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(duplicate.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Duplicate tab: 45 mm spacing');
    await duplicate.close();
  });
});

test.describe('replacing the open plan', () => {
  test('accepting a share link keeps the edited plan as a named copy and says where', async ({ page }) => {
    await openPlanner(page);
    await rename(page, 'Unsaved: heater at 2 mm');
    await page.getByRole('button', { name: 'Copy share link' }).click();
    const url = await page.getByRole('textbox', { name: 'Share link' }).inputValue();
    await rename(page, 'Unsaved: heater at 3 mm');
    await page.evaluate((u) => {
      location.hash = new URL(u).hash;
    }, url);
    const prompt = page.getByRole('alertdialog', { name: 'Open the shared plan?' });
    await expect(prompt).toContainText('kept in Saved plans first');
    await prompt.getByRole('button', { name: 'Open shared plan' }).click();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Unsaved: heater at 2 mm');
    const note = page.locator('.plan-bar__note');
    await expect(note).toContainText('Your previous plan is kept in Saved plans as “Unsaved: heater at 3 mm (kept');
    // Durable: it is there after a reload.
    await page.reload();
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await savedPlansPanel(page);
    // Listed with the kept copies, apart from the plans saved by hand.
    await expect(page.getByRole('list', { name: 'Kept copies' })).toContainText('Unsaved: heater at 3 mm (kept');
  });

  test('"Open the demo" keeps the edited plan first', async ({ page }) => {
    await openPlanner(page);
    await rename(page, 'Edited before the demo');
    await page.getByRole('button', { name: 'Open the demo' }).click();
    await expect(page.locator('.plan-bar__note')).toContainText('Your previous plan is kept in Saved plans as “Edited before the demo (kept');
    await savedPlansPanel(page);
    await expect(page.getByRole('list', { name: 'Kept copies' })).toContainText('Edited before the demo (kept');
  });
});

test.describe('newer format and crafted links', () => {
  test('an autosave of a newer format version is named as newer, not opened, and never overwritten', async ({ page }) => {
    const demo = (await (await page.request.get('./demo-plan.json')).json()) as Record<string, unknown>;
    const newer = JSON.stringify({ ...demo, version: (demo.version as number) + 1, name: 'Saved by tomorrow’s Sekundo' });
    await page.addInitScript((text) => {
      if (!sessionStorage.getItem('seeded')) {
        localStorage.setItem('sekundo.autosave', text);
        sessionStorage.setItem('seeded', '1');
      }
    }, newer);
    await openPlanner(page);
    await expect(page.getByRole('status').filter({ hasText: 'newer Sekundo' })).toContainText('kept untouched: reload the page to get the newer app');
    await expect(page.getByRole('status').filter({ hasText: 'newer Sekundo' })).not.toContainText('damaged');
    await rename(page, 'Edited in the older page');
    await autosaved(page, 'Edited in the older page');
    expect(await page.evaluate(() => localStorage.getItem('sekundo.autosave'))).toBe(newer);
  });

  test('a link that unpacks past the size cap is refused at once as too large', async ({ page }) => {
    const huge = lzString.compressToEncodedURIComponent('{"format":"sekundo-plan","name":"'.padEnd(4_100_000, 'x'));
    expect(huge.length).toBeLessThan(200_000);
    await page.goto(`./#plan=1.${huge}`);
    const alert = page.getByRole('alert').filter({ hasText: 'The plan link could not be opened' });
    await expect(alert).toContainText('too large');
    await expect(alert).not.toContainText('damaged');
    await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  });
});
