import { expect, type Locator, type Page } from '@playwright/test'
import { shot } from './helpers'

/** The demo scenario's data set that is submitted with review threads (db/seeds/lab-scenario.ts): the lead chemist approves it. */
export const SUBMITTED_WITH_THREADS = 'SR-24 mother liquor: 1-propanol/water at 1 atm'
/** A second submitted series with one open question: the reviewer's journey comments on it. */
export const SUBMITTED_FOR_REVIEW = 'Kestrel wash water: methanol/water at 1 atm'
/** A third submitted series: the rework journey returns it, the analyst reworks and resubmits it. */
export const SUBMITTED_FOR_REWORK = 'Kestrel recycle repeat: acetone/methanol at 1 atm'
/** Approved as version 2 (version 1 superseded): the rework journey revises it into version 3. */
export const APPROVED_TO_REVISE = 'Wash solvent: n-hexane/n-heptane at 1 atm'
/** The open draft: the workspace-tools journey fits, edits and checks it. */
export const OPEN_DRAFT = 'Column feed: methanol/water at 1 atm'

/** Open a data set from the list by its title (and version, when several versions share the title). */
export async function openDataSet(page: Page, title: string, version?: number) {
  await page.goto('/datasets')
  await page.getByLabel('Search').fill(title.split(':')[0])
  const rows = page.getByTestId('datasets-table').locator('tbody tr').filter({ hasText: title })
  const row = version === undefined ? rows.first() : rows.filter({ hasText: `v${version}` }).first()
  await row.getByRole('link', { name: title }).click()
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
    const tip = plot
      .locator('div')
      .filter({ hasText: label })
      .filter({ hasText: /liquid/i })
    if (
      await tip
        .first()
        .isVisible()
        .catch(() => false)
    ) {
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
