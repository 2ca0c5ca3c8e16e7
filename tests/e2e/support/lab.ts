import { expect, type Locator, type Page } from '@playwright/test'
import { shot } from './helpers'

/** The demo scenario's data set that is submitted with review threads (db/seeds/lab-scenario.ts). */
export const SUBMITTED_WITH_THREADS = 'SR-24 mother liquor: 1-propanol/water at 1 atm'

/** Open a data set from the list by its title. */
export async function openDataSet(page: Page, title: string) {
  await page.goto('/datasets')
  await page.getByLabel('Search').fill(title.split(':')[0])
  await page.getByRole('link', { name: title }).first().click()
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible()
}

/**
 * Click the measured liquid point of sample `label` on the T–x–y plot, as a person would with the mouse.
 * The plot is a canvas, so the point is found by its composition: x is fixed by the 0–1 axis and the
 * plot's margins (62 px left, 24 px right, components/plots/txy-option.ts); the height is found by hovering
 * down that vertical line until the plot's tooltip names the sample.
 */
export async function clickLiquidPoint(page: Page, plot: Locator, label: string, x1: number) {
  const canvas = plot.locator('canvas').first()
  const box = (await canvas.boundingBox())!
  const x = box.x + 62 + x1 * (box.width - 62 - 24)
  for (let y = box.y + 30; y < box.y + box.height - 50; y += 3) {
    await page.mouse.move(x, y)
    const tip = plot.locator('div').filter({ hasText: label }).filter({ hasText: /liquid/i })
    if (await tip.first().isVisible().catch(() => false)) {
      await page.mouse.click(x, y)
      return
    }
  }
  throw new Error(`no point ${label} found on the plot at x1 = ${x1}`)
}

/** A full-page screenshot taken from the top, so the sticky top bar and navigation sit where a person sees them. */
export async function snap(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0))
  await page.waitForTimeout(150)
  await shot(page, name)
}
