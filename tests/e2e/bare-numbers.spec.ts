/**
 * One rule in every view, checked in Chromium: a bare number is in the unit the field shows. In
 * the planner, 30 typed where "10 mm" stood is 30 mm, and 5 in a heat-flux field shown in W/cm² is
 * 5 W/cm² — as in the converter and the locate view.
 */
import { expect, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

guardEveryPage();

test('planner: a bare number is in the unit the field shows', async ({ page }) => {
  await page.goto('./');
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  // The box holds the number; the unit it is in stands beside it (src/ui/fields/QuantityField.tsx).
  const unitBeside = (box: typeof distance) => box.locator('xpath=following-sibling::*[1]');
  const distance = page.getByRole('textbox', { name: 'Sensor 1 distance', exact: true });
  await expect(distance).toHaveValue('10');
  await expect(unitBeside(distance)).toHaveText('mm');
  await distance.fill('30');
  await distance.press('Tab');
  await expect(distance).toHaveValue('30');
  await expect(unitBeside(distance)).toHaveText('mm');

  const flux = page.getByRole('textbox', { name: 'Peak heat flux' });
  await expect(unitBeside(flux)).toHaveText('W/cm²');
  await flux.fill('5');
  await flux.press('Tab');
  await expect(flux).toHaveValue('5');
  await expect(unitBeside(flux)).toHaveText('W/cm²');
  // The plan itself holds SI (as autosaved): 0.03 m and 50000 W/m².
  await expect
    .poll(() =>
      page.evaluate(() => {
        const key = Object.keys(localStorage).find((k) => k.startsWith('sekundo.autosave.')) ?? '';
        const record = JSON.parse(localStorage.getItem(key) ?? '{}') as { plan?: string };
        const p = JSON.parse(record.plan ?? '{}') as { sensors?: { distance_m?: number }[]; heater?: { flux_W_m2?: number } };
        return [p.sensors?.[0]?.distance_m, p.heater?.flux_W_m2];
      }),
    )
    .toEqual([0.03, 50000]);
});
