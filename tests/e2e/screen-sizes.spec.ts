import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

/*
 * Every view on a phone beside the cryostat, on a tablet and on a desktop: no view may scroll
 * sideways as a page (tables scroll inside their own frame), the active tab stays in sight, no
 * symbol or unit is set in capitals, and a screenshot of each view is kept at 390 px and 1440 px in
 * both themes.
 */

const ARTIFACTS = 'test-results/artifacts/screens';

/** The views and the modes inside them that change the layout, each reached by its tab's name. */
const STOPS: readonly { id: string; tabs: readonly string[] }[] = [
  { id: 'explorer', tabs: ['Helium properties'] },
  { id: 'planner', tabs: ['Plan a measurement'] },
  { id: 'converter-reading', tabs: ['Read the temperature', 'One reading', 'One delay'] },
  { id: 'converter-distances', tabs: ['Read the temperature', 'One reading', 'Several distances'] },
  { id: 'converter-sweep', tabs: ['Read the temperature', 'One reading', 'Path length from a sweep'] },
  { id: 'converter-batch', tabs: ['Read the temperature', 'Batch file'] },
  { id: 'converter-trace', tabs: ['Read the temperature', 'Trace lab'] },
  { id: 'locate', tabs: ['Locate a source'] },
  { id: 'resonator', tabs: ['Resonator'] },
];

async function open(page: Page, tabs: readonly string[]) {
  for (const name of tabs) {
    const tab = page.getByRole('tab', { name, exact: true });
    await tab.click();
    await expect(tab).toHaveAttribute('aria-selected', 'true');
  }
  // Charts are drawn after Plotly loads; a late chart must not widen the page either.
  await page.waitForLoadState('networkidle');
  for (const chart of await page.locator('[data-chart]').all()) await expect(chart).toHaveAttribute('data-drawn', 'true');
}

/** How far the page reaches past the window, px (0 when nothing sticks out). */
function sidewaysOverflow(page: Page) {
  return page.evaluate(() => {
    const root = document.documentElement;
    return { overflow: root.scrollWidth - root.clientWidth, scrolledX: window.scrollX };
  });
}

/**
 * Text set in capitals by the style sheet that holds a symbol or a unit, whose case is its meaning
 * (u₂ is not U₂, µs is not ΜS, mK is not MK): there should be none.
 */
function symbolsInCapitals(page: Page) {
  return page.evaluate(() => {
    const symbol = /[µμ\u2080-\u2089λκΔδσ]|(?<!\w)(mK|ms|mm|Hz|kHz|Pa|mbar|W\/cm²|m\/s|df\/dT)(?!\w)/;
    const found: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('body *')) {
      if (getComputedStyle(el).textTransform !== 'uppercase' || el.offsetParent === null) continue;
      const own = [...el.childNodes].filter((n) => n.nodeType === Node.TEXT_NODE).map((n) => n.textContent ?? '').join('');
      if (symbol.test(own)) found.push(own.trim());
    }
    return found;
  });
}

/** The widest elements that stick out past the window and are not inside a scrolling frame: named in a failure. */
function culprits(page: Page) {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const found: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('body *')) {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.right <= width + 1) continue;
      let frame = el.parentElement;
      let framed = false;
      while (frame && frame !== document.body) {
        if (/(auto|scroll|hidden|clip)/.test(getComputedStyle(frame).overflowX)) {
          framed = true;
          break;
        }
        frame = frame.parentElement;
      }
      if (!framed) found.push(`${el.tagName.toLowerCase()}.${[...el.classList].join('.')} (right edge ${Math.round(box.right)} px)`);
    }
    return found.slice(0, 8);
  });
}

test.describe('every screen size', () => {
  guardEveryPage();

  for (const viewport of [
    { width: 360, height: 740 },
    { width: 390, height: 844 },
    { width: 768, height: 1024 },
  ]) {
    test(`no view scrolls sideways at ${viewport.width} × ${viewport.height}`, async ({ page }) => {
      await page.setViewportSize(viewport);
      await page.goto('/');
      await expect(page.getByRole('heading', { level: 1, name: 'Sekundo' })).toBeVisible();
      // At 390 px this test also keeps the light theme's screenshots (the loop below shoots the rest).
      if (viewport.width === 390) await page.getByRole('radio', { name: 'Light', exact: true }).check();
      for (const stop of STOPS) {
        await open(page, stop.tabs);
        const { overflow, scrolledX } = await sidewaysOverflow(page);
        expect(overflow, `${stop.id} at ${viewport.width} px sticks out: ${(await culprits(page)).join('; ')}`).toBeLessThanOrEqual(0);
        expect(scrolledX, `${stop.id} at ${viewport.width} px is scrolled sideways`).toBe(0);
        // The chosen view's tab is in sight inside its strip.
        const viewTab = page.getByRole('tablist', { name: 'Sekundo views' }).getByRole('tab', { selected: true });
        await expect(viewTab).toBeInViewport({ ratio: 0.9 });
        if (viewport.width === 390) {
          await page.screenshot({ path: `${ARTIFACTS}/${stop.id}-390-light.png`, fullPage: true });
          expect(await symbolsInCapitals(page), `${stop.id}: symbols or units set in capitals`).toEqual([]);
        }
      }
      // The display-units panel opens inside the window.
      await page.getByRole('button', { name: /^Units/ }).click();
      const panel = page.getByRole('region', { name: 'Display units' });
      await expect(panel).toBeVisible();
      const box = await panel.boundingBox();
      expect(box?.x ?? -1).toBeGreaterThanOrEqual(0);
      expect((box?.x ?? 0) + (box?.width ?? Number.POSITIVE_INFINITY)).toBeLessThanOrEqual(viewport.width);
      expect((await sidewaysOverflow(page)).overflow).toBeLessThanOrEqual(0);
      await page.getByRole('button', { name: 'Done' }).click();
    });
  }

  test('tables scroll inside their own frame with the first column kept', async ({ page }) => {
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto('/');
    await open(page, ['Plan a measurement']);
    const frame = page.locator('.table-scroll').filter({ has: page.locator('table.sensors-table') });
    const scrollable = await frame.evaluate((el) => el.scrollWidth > el.clientWidth);
    expect(scrollable).toBe(true);
    const firstCell = frame.locator('tbody tr').first().locator('td, th').first();
    const before = await firstCell.boundingBox();
    await frame.evaluate((el) => {
      el.scrollLeft = el.scrollWidth;
    });
    const after = await firstCell.boundingBox();
    expect(before).not.toBeNull();
    expect(after?.x).toBeCloseTo(before?.x ?? Number.NaN, 0);
  });

  // Light at 390 px: shot by the sideways test above.
  for (const theme of ['Light', 'Dark'] as const) {
    for (const viewport of theme === 'Light' ? [{ width: 1440, height: 900 }] : [{ width: 390, height: 844 }, { width: 1440, height: 900 }]) {
      test(`screenshots of every view, ${theme.toLowerCase()} theme, ${viewport.width} px`, async ({ page }) => {
        await page.setViewportSize(viewport);
        await page.goto('/');
        await page.getByRole('radio', { name: theme, exact: true }).check();
        await expect(page.locator('html')).toHaveAttribute('data-theme', theme.toLowerCase());
        for (const stop of STOPS) {
          await open(page, stop.tabs);
          await page.screenshot({ path: `${ARTIFACTS}/${stop.id}-${viewport.width}-${theme.toLowerCase()}.png`, fullPage: true });
        }
        // The header's units panel and a help panel open, in this theme.
        await open(page, ['Helium properties']);
        await page.getByRole('button', { name: /^Units/ }).click();
        await page.getByRole('button', { name: 'Help: temperature' }).click({ force: true });
        await page.screenshot({ path: `${ARTIFACTS}/units-and-help-${viewport.width}-${theme.toLowerCase()}.png` });
        await page.keyboard.press('Escape');
      });
    }
  }
});
