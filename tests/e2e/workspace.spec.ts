/**
 * The workspace in Chromium: the setup sheet on paper (print media, screenshot and PDF), a reload
 * mid-edit, a refused plan file, a share link into a fresh browser and a broken one, storage that
 * is turned off, HTML in names and labels, and no request leaving 127.0.0.1.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { type BrowserContext, expect, type Page, test } from '@playwright/test';

const ARTIFACTS = 'test-results/artifacts';
const TIMELINE = '[data-chart="planner-timeline"]';
const DEMO_NAME = 'Orrin-2 insert: three-depth time-of-flight check at 1.80 K';
const PAYLOAD = '<img src=x onerror=alert(1)>';

/** The first-visit guides are put away, so the views show as a returning visitor sees them. */
async function putGuidesAway(target: Page | BrowserContext) {
  await target.addInitScript(() => {
    try {
      if (!localStorage.getItem('sekundo.prefs')) localStorage.setItem('sekundo.prefs', JSON.stringify({ guides: 'explorer,planner,converter,locate' }));
    } catch {
      // Storage off: the guides show, covering nothing.
    }
  });
}

async function openPlanner(page: Page, url = '/') {
  await page.goto(url);
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  await expect(page.getByRole('textbox', { name: 'Plan name' })).toBeVisible();
  await expect(page.locator(TIMELINE)).toHaveAttribute('data-drawn', 'true');
}

const requests: string[] = [];
const problems: string[] = [];

function watch(page: Page) {
  page.on('request', (request) => requests.push(request.url()));
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('dialog', (dialog) => {
    problems.push(`dialog: ${dialog.type()} ${dialog.message()}`);
    void dialog.dismiss();
  });
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console: ${message.text()}`);
  });
}

test.describe('workspace', () => {
  test.beforeAll(() => mkdirSync(ARTIFACTS, { recursive: true }));

  test.beforeEach(async ({ page }) => {
    requests.length = 0;
    problems.length = 0;
    watch(page);
  });

  test.afterEach(() => {
    const outside = requests.filter((url) => {
      const { protocol, hostname } = new URL(url);
      return !(protocol === 'data:' || protocol === 'blob:' || hostname === '127.0.0.1');
    });
    expect(outside, 'no request may leave 127.0.0.1').toEqual([]);
    expect(problems).toEqual([]);
  });

  test('(a) plan from the demo and print the setup sheet', async ({ page }) => {
    await putGuidesAway(page);
    await page.addInitScript(() => {
      (window as unknown as { printCalls: number }).printCalls = 0;
      window.print = () => {
        (window as unknown as { printCalls: number }).printCalls += 1;
      };
    });
    await openPlanner(page);
    const name = page.getByRole('textbox', { name: 'Plan name' });
    await name.fill('Bench 3: four bolometers at 1.80 K');
    await name.press('Tab');
    await page.getByRole('button', { name: 'Print setup sheet' }).click();
    const sheet = page.getByRole('article', { name: 'Setup sheet' });
    await expect(sheet.getByRole('heading', { name: 'Setup sheet: Bench 3: four bolometers at 1.80 K' })).toBeVisible();
    await expect.poll(() => page.evaluate(() => (window as unknown as { printCalls: number }).printCalls)).toBe(1);
    await page.screenshot({ path: `${ARTIFACTS}/workspace-setup-sheet-screen.png`, fullPage: true });

    await page.emulateMedia({ media: 'print' });
    await expect(page.locator('#root')).toBeHidden();
    await expect(page.getByRole('button', { name: 'Print or save as PDF' })).toBeHidden();
    await expect(sheet.getByRole('heading', { name: 'Before the cooldown' })).toBeVisible();
    await expect(sheet.getByRole('heading', { name: 'Cryogenic cautions' })).toBeVisible();
    await expect(sheet).toContainText('Heater resistance at room temperature');
    await expect(sheet).toContainText('Bolometer D, 50 mm');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-setup-sheet-print.png`, fullPage: true });
    const pdf = await page.pdf({ path: `${ARTIFACTS}/workspace-setup-sheet.pdf`, format: 'A4', printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.length).toBeGreaterThan(10_000);
    await page.emulateMedia({ media: 'screen' });
    await page.getByRole('button', { name: 'Back to the planner' }).click();
    await expect(page.getByRole('article', { name: 'Setup sheet' })).toHaveCount(0);
  });

  test('(d) reload mid-edit: the plan and the saved plans are back', async ({ page }) => {
    await putGuidesAway(page);
    await openPlanner(page);
    await page.getByRole('button', { name: /Saved plans/ }).click();
    await page.getByRole('textbox', { name: 'Save the open plan as' }).fill('Before the reload');
    await page.getByRole('button', { name: 'Save as new' }).click();
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Before the reload');
    const name = page.getByRole('textbox', { name: 'Plan name' });
    await name.fill('Typed just before the reload');
    await page.reload();
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Typed just before the reload');
    await expect(page.getByText('Restored from your last visit')).toBeVisible();
    await page.getByRole('button', { name: /Saved plans \(1\)/ }).click();
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Before the reload');
    // Delete, then undo from the toast.
    await page.getByRole('button', { name: 'Delete “Before the reload”' }).click();
    await expect(page.getByText('No saved plans yet.')).toBeVisible();
    await page.getByRole('button', { name: 'Undo', exact: true }).click();
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText('Before the reload');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-restored.png` });
    // Undo of an edit by key.
    await page.getByRole('button', { name: 'Open “Before the reload”' }).click();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue(DEMO_NAME);
    await page.locator('body').click({ position: { x: 5, y: 300 } });
    await page.keyboard.press('Control+z');
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Typed just before the reload');
  });

  test('(e) a broken plan file is refused with its messages; the plan is intact', async ({ page }) => {
    await putGuidesAway(page);
    await openPlanner(page);
    await page.getByLabel('Plan file to open').setInputFiles({
      name: 'negative-width.json',
      mimeType: 'application/json',
      buffer: readFileSync('tests/corpus/plans/negative-width.json'),
    });
    const alert = page.getByRole('alert').filter({ hasText: 'was not opened' });
    await expect(alert).toContainText('“negative-width.json” was not opened; the current plan is kept');
    await expect(alert.getByRole('listitem').first()).toBeVisible();
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue(DEMO_NAME);
    await expect(page.getByText('Demo plan (invented setup)')).toBeVisible();
    await page.screenshot({ path: `${ARTIFACTS}/workspace-broken-file.png` });
  });

  test('(e) share link round trip into a fresh browser, and a broken link', async ({ page, browser }) => {
    await putGuidesAway(page);
    await openPlanner(page);
    const name = page.getByRole('textbox', { name: 'Plan name' });
    await name.fill('Shared from bench 3');
    await name.press('Tab');
    await page.getByRole('button', { name: 'Copy share link' }).click();
    const url = await page.getByRole('textbox', { name: 'Share link' }).inputValue();
    expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/#plan=1\./);

    const other = await browser.newContext({ viewport: { width: 1280, height: 720 } });
    await putGuidesAway(other);
    const colleague = await other.newPage();
    watch(colleague);
    await colleague.goto(url);
    // A fresh browser has no work of its own to lose: the link opens on its plan at once, asking nothing.
    await expect(colleague.getByRole('tab', { name: 'Plan a measurement' })).toHaveAttribute('aria-selected', 'true');
    await expect(colleague.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Shared from bench 3');
    await expect(colleague.getByRole('alertdialog')).toHaveCount(0);
    await expect(colleague.locator(TIMELINE)).toHaveAttribute('data-drawn', 'true');
    await colleague.screenshot({ path: `${ARTIFACTS}/workspace-share-opened.png` });
    await expect(colleague.getByText('From a shared link')).toBeVisible();
    expect(new URL(colleague.url()).hash).toBe('');

    // A broken link: the message, and nothing changes.
    await colleague.goto('/?again#plan=1.N4Ig');
    await expect(colleague.getByRole('alert').filter({ hasText: 'The plan link could not be opened' })).toBeVisible();
    await colleague.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(colleague.getByRole('textbox', { name: 'Plan name' })).toHaveValue('Shared from bench 3');
    await expect(colleague.getByRole('alertdialog')).toHaveCount(0);
    await colleague.screenshot({ path: `${ARTIFACTS}/workspace-broken-link.png` });
    await other.close();
  });

  test('(e) storage turned off: the app works and says so', async ({ page }) => {
    await page.addInitScript(() => {
      Object.defineProperty(window, 'localStorage', {
        configurable: true,
        get() {
          throw new DOMException('The operation is insecure.', 'SecurityError');
        },
      });
    });
    await page.goto('/');
    await expect(page.getByText(/does not let Sekundo keep data/)).toBeVisible();
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await expect(page.locator(TIMELINE)).toHaveAttribute('data-drawn', 'true');
    const name = page.getByRole('textbox', { name: 'Plan name' });
    await name.fill('Only in this tab');
    await name.press('Tab');
    await page.getByRole('button', { name: 'Undo', exact: false }).first().click();
    await expect(name).toHaveValue(DEMO_NAME);
    await expect(page.getByText(/Changes are not being kept in this browser/)).toBeVisible();
    await page.screenshot({ path: `${ARTIFACTS}/workspace-storage-off.png` });
  });

  test('names and labels with HTML stay text: no element, no dialog', async ({ page }) => {
    await putGuidesAway(page);
    await openPlanner(page);
    const plan = JSON.parse(readFileSync('public/demo-plan.json', 'utf8')) as {
      name: string;
      sensors: { label: string }[];
      reflectors: { label: string }[];
    };
    plan.name = `Plan ${PAYLOAD}`;
    if (plan.sensors[0]) plan.sensors[0].label = `Sensor ${PAYLOAD}`;
    if (plan.reflectors[0]) plan.reflectors[0].label = 'Lid <svg onload=alert(3)>';
    await page.getByLabel('Plan file to open').setInputFiles({ name: `${PAYLOAD}.json`, mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(plan)) });
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue(`Plan ${PAYLOAD}`);
    await expect(page.locator(TIMELINE)).toHaveAttribute('data-drawn', 'true');
    await page.getByRole('button', { name: /Saved plans/ }).click();
    await page.getByRole('button', { name: 'Save as new' }).click();
    await expect(page.getByRole('list', { name: 'Saved plans' })).toContainText(`Plan ${PAYLOAD}`);
    await page.getByRole('button', { name: 'Copy share link' }).click();
    const url = await page.getByRole('textbox', { name: 'Share link' }).inputValue();
    // The open plan is the file as opened (and saved): nothing to lose, so the link opens at once.
    await page.goto(url);
    await expect(page.getByText('From a shared link')).toBeVisible();
    await expect(page.getByRole('alertdialog')).toHaveCount(0);
    await expect(page.getByRole('textbox', { name: 'Plan name' })).toHaveValue(`Plan ${PAYLOAD}`);
    await page.addInitScript(() => {
      window.print = () => undefined;
    });
    await page.getByRole('button', { name: 'Print setup sheet' }).click();
    await expect(page.getByRole('article', { name: 'Setup sheet' })).toContainText(`Sensor ${PAYLOAD}`);
    const injected = await page.evaluate(() => ({
      img: document.querySelectorAll('img').length,
      svgOnload: document.querySelectorAll('svg[onload]').length,
      handlers: [...document.querySelectorAll('*')].filter((el) => el.getAttributeNames().some((a) => a.startsWith('on'))).length,
    }));
    expect(injected).toEqual({ img: 0, svgOnload: 0, handlers: 0 });
  });
});
