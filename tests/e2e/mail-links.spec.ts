import { readFileSync } from 'node:fs'
import { expect, test, type APIRequestContext, type Locator, type Page } from '@playwright/test'
import { baseURL } from '../../playwright.config'
import { DEMO, DEMO_PASSWORD, linkFrom, signIn, signOut, waitForMail } from './support/helpers'
import { snap } from './support/lab'

/**
 * Every mailed link opens its page in the browser, and markup planted (through the API) in every text the lab
 * types — component names (hence the system's name), the data set's title, sample labels, an exclusion reason,
 * a comment — shows as text on the screens and in the plot tooltips: no element is created, no script runs.
 * Works on a system and data set of its own (invented data: docs/examples), so it depends on no other journey.
 */
const IMG = (n: number) => `<img src=x onerror=window.__owned=${n}>`
const META = '<meta http-equiv=refresh content=0;url=/forbidden>'
const TITLE = `Markup check ${IMG(1)} series`
const LABEL_IMG = IMG(2)
const LABEL_META = META
const REASON = `septum leak ${IMG(3)}`
const json = { headers: { Origin: baseURL } }

async function post(api: APIRequestContext, url: string, data: unknown, status = [200, 201]) {
  const r = await api.post(url, { ...json, data: data as Record<string, unknown> })
  expect(status, `${url}: ${await r.text()}`).toContain(r.status())
  return r.json()
}

/** Move the mouse down the vertical line of composition x1 on the T–x–y plot until the tooltip shows `text`. */
async function hoverPointShowing(page: Page, plot: Locator, text: string, x1: number) {
  const canvas = plot.locator('canvas').first()
  const box = (await canvas.boundingBox())!
  const x = box.x + 62 + x1 * (box.width - 62 - 24)
  for (let y = box.y + 30; y < box.y + box.height - 50; y += 3) {
    await page.mouse.move(x, y)
    if (
      await plot
        .locator('div')
        .filter({ hasText: text })
        .first()
        .isVisible()
        .catch(() => false)
    )
      return
  }
  throw new Error(`no tooltip showing ${text} at x1 = ${x1}`)
}

/** The data set's own page: its title (markup and all) as the text of the page heading. */
async function expectDataSetPage(page: Page) {
  const h1 = page.locator('h1').filter({ hasText: 'Markup check' })
  await expect(h1).toBeVisible({ timeout: 30_000 })
  expect(await h1.innerText()).toBe(TITLE)
}

async function expectNothingInjected(page: Page) {
  await expect(page.locator('img[src="x"]')).toHaveCount(0)
  await expect(page.locator('meta[http-equiv="refresh"]')).toHaveCount(0)
  expect(await page.evaluate(() => (window as unknown as { __owned?: number }).__owned)).toBeUndefined()
}

test('each mailed link opens the data set; planted markup stays text on screens and tooltips', async ({ page }) => {
  test.setTimeout(180_000)
  // A lead chemist names the components (the system's name comes from them); an analyst builds the series.
  await signIn(page, DEMO.lead)
  const api = page.request
  const stamp = Date.now().toString(36)
  const components: string[] = []
  for (const c of [
    { name: `Acetone ${stamp} ${IMG(4)}`, mm: 58.08, v: 74.05, A: 14.3145, B: 2756.22, C: 228.06, range: [-26, 77] },
    { name: `Methanol ${stamp} ${META}`, mm: 32.042, v: 40.73, A: 16.5785, B: 3638.27, C: 239.5, range: [-11, 83] },
  ]) {
    const made = await post(api, '/api/components', { name: c.name, molarMass: c.mm, liquidMolarVolume: c.v })
    // Antoine constants: Smith, Van Ness & Abbott, 7th ed., Table B.2 (ln, kPa, °C)
    await post(api, `/api/components/${made.id}/vapor-pressure-sets`, {
      model: {
        kind: 'antoine',
        A: c.A,
        B: c.B,
        C: c.C,
        log: 'ln',
        pressureUnit: 'kPa',
        temperatureUnit: 'C',
        range: c.range,
      },
      source: 'Smith, Van Ness & Abbott, 7th ed., Table B.2',
      preferred: true,
    })
    components.push(made.id)
  }
  await signOut(page)
  await signIn(page, DEMO.analyst)
  const system = await post(api, '/api/systems', { component1Id: components[0], component2Id: components[1] })
  const gc = await post(api, '/api/gc-methods', {
    name: `FID markup ${stamp}`,
    detector: 'FID',
    columnDescription: 'porous polymer, 25 m',
    conditions: '120 °C isothermal',
  })
  const multipart = (file: string, name: string, fields: Record<string, string>) => ({
    headers: { Origin: baseURL },
    multipart: { file: { name, mimeType: 'text/csv', buffer: Buffer.from(file) }, ...fields },
  })
  const cal = await api.post(
    '/api/calibrations',
    multipart(readFileSync('docs/examples/calibration-acetone-methanol.csv', 'utf8'), 'calibration.csv', {
      gcMethodId: gc.id,
      systemId: system.id,
      model: 'response-factor',
      acceptWarnings: 'true',
    }),
  )
  expect(cal.status(), await cal.text()).toBe(201)
  const d = await post(api, '/api/data-sets', { systemId: system.id, title: TITLE, nominalPressurePa: 101325 })
  const run = readFileSync('docs/examples/run-acetone-methanol.csv', 'utf8')
    .replaceAll('AM-01', LABEL_IMG)
    .replaceAll('AM-02', LABEL_META)
  const up = await api.post(
    `/api/data-sets/${d.id}/uploads`,
    multipart(run, 'run.csv', { rowVersion: String(d.rowVersion), acceptWarnings: 'true' }),
  )
  expect(up.status(), await up.text()).toBe(201)
  const detail = await (await api.get(`/api/data-sets/${d.id}`)).json()
  const [first, second] = detail.points
  const ex = await api.patch(`/api/data-sets/${d.id}/points/${second.id}`, {
    ...json,
    data: { excluded: true, reason: REASON, rowVersion: (await up.json()).rowVersion },
  })
  expect(ex.status(), await ex.text()).toBe(200)
  const fit = await post(api, `/api/data-sets/${d.id}/fits`, { models: ['wilson'] })
  await post(api, `/api/data-sets/${d.id}/submit`, { rowVersion: fit.rowVersion })
  await signOut(page)

  // 1. the lead chemist follows the "submitted" link
  await signIn(page, DEMO.lead)
  const submitted = await waitForMail(DEMO.lead, /Markup check .* submitted for approval/)
  await page.goto(linkFrom(submitted, '/datasets/'))
  await expectDataSetPage(page)
  await expect(page.getByTestId('points-table')).toContainText(LABEL_IMG)
  await expect(page.getByTestId('points-table')).toContainText(LABEL_META)
  const plot = page.getByTestId('txy-plot')
  await hoverPointShowing(page, plot, LABEL_IMG, first.x1)
  await expectNothingInjected(page)
  await hoverPointShowing(page, plot, REASON, second.x1)
  await expectNothingInjected(page)
  await snap(page, 'mail-link-markup-tooltip')
  expect(new URL(page.url()).pathname).toBe(`/datasets/${d.id}`)

  // 2. the lead chemist comments; the analyst replies; the lead follows the reply link
  const comment = await post(api, `/api/data-sets/${d.id}/comments`, { body: `Check ${IMG(5)} please.` })
  const sig = await post(api, `/api/data-sets/${d.id}/return`, {
    password: DEMO_PASSWORD,
    reason: `Re-run ${IMG(6)}`,
    rowVersion: (await (await api.get(`/api/data-sets/${d.id}`)).json()).rowVersion,
  })
  expect(sig).toBeTruthy()
  await signOut(page)

  // 3. the analyst follows the "returned" link, then replies to the comment
  await signIn(page, DEMO.analyst)
  const returned = await waitForMail(DEMO.analyst, /Markup check .* returned for rework/)
  await page.goto(linkFrom(returned, '/datasets/'))
  await expectDataSetPage(page)
  await expect(page.getByTestId('threads-panel')).toContainText(`Check ${IMG(5)} please.`)
  await expectNothingInjected(page)
  await post(api, `/api/data-sets/${d.id}/comments`, { body: `Done ${IMG(7)}`, parentId: comment.id })
  await signOut(page)

  await signIn(page, DEMO.lead)
  const reply = await waitForMail(DEMO.lead, /replied to your comment on "Markup check/)
  await page.goto(linkFrom(reply, '/datasets/'))
  await expectDataSetPage(page)
  await expect(page.getByTestId('threads-panel')).toContainText(`Done ${IMG(7)}`)
  await expectNothingInjected(page)

  // 4. the lead resolves their thread; the analyst submits again; the lead approves; the analyst follows the
  //    "approved" link
  await post(api, `/api/data-sets/${d.id}/comments/${comment.id}/resolve`, {})
  await signOut(page)
  await signIn(page, DEMO.analyst)
  await post(api, `/api/data-sets/${d.id}/submit`, {
    rowVersion: (await (await api.get(`/api/data-sets/${d.id}`)).json()).rowVersion,
  })
  await signOut(page)
  await signIn(page, DEMO.lead)
  const rec = await post(api, `/api/data-sets/${d.id}/recommended-fit`, { fitId: fit.fits[0].id })
  await post(api, `/api/data-sets/${d.id}/approve`, {
    password: DEMO_PASSWORD,
    reason: `Approved ${IMG(8)}`,
    rowVersion: rec.rowVersion,
  })
  await signOut(page)
  await signIn(page, DEMO.analyst)
  const approved = await waitForMail(DEMO.analyst, /Markup check .* approved$/)
  await page.goto(linkFrom(approved, '/datasets/'))
  await expectDataSetPage(page)
  await expect(page.locator('[data-state]').first()).toHaveAttribute('data-state', 'approved')
  await expectNothingInjected(page)
  expect(new URL(page.url()).pathname).toBe(`/datasets/${d.id}`)
})
