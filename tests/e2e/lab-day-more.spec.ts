import path from 'node:path'
import { expect, test, type APIRequestContext, type Page } from '@playwright/test'
import { baseURL } from '../../playwright.config'
import { DEMO, signIn } from './support/helpers'
import { APPROVED_TO_REVISE, OPEN_DRAFT, snap } from './support/lab'

/**
 * More of a lab's day (issue 11): GC check standards charted per method, literature data drawn beside the lab's
 * own on a system's plots, and where to measure next within a range the lab chooses, shown on both plots.
 * Data planted through the API is INVENTED for the journey (no source); the screens are what is tested.
 */
const json = { headers: { Origin: baseURL } }

async function call(api: APIRequestContext, method: 'get' | 'post', url: string, data?: unknown) {
  const r = method === 'get' ? await api.get(url) : await api.post(url, { ...json, data: data as object })
  expect([200, 201], `${url}: ${await r.text()}`).toContain(r.status())
  return r.json()
}

async function draftId(page: Page, title: string) {
  const list = await call(page.request, 'get', `/api/data-sets?q=${encodeURIComponent(title.split(':')[0])}`)
  const d = list.items.find((x: { title: string }) => x.title === title)
  return { id: d.id as string, rowVersion: d.rowVersion as number, systemId: d.systemId as string }
}

/**
 * n-hexane/n-heptane at 101.325 kPa by Raoult's law with the demo's Antoine constants (SVNA 7th ed. Table B.2),
 * rounded to 0.01 K and 0.001: [x1, T / K, y1].
 */
const HEXANE_HEPTANE = [
  [0.05, 369.34, 0.11],
  [0.15, 365.25, 0.296],
  [0.25, 361.54, 0.446],
  [0.35, 358.17, 0.569],
  [0.45, 355.09, 0.67],
  [0.55, 352.25, 0.754],
  [0.65, 349.63, 0.825],
  [0.75, 347.21, 0.885],
  [0.85, 344.95, 0.936],
  [0.95, 342.85, 0.98],
]
const typed = (rows: number[][]) =>
  rows.map(([x1, T, y1], i) => ({
    sampleLabel: `L${i + 1}`,
    temperatureK: T,
    pressurePa: 101325,
    x1,
    y1,
    x1Uncertainty: 0.002,
    y1Uncertainty: 0.003,
  }))

/** A literature data set of the system with typed points; returns its id and row version. */
async function literatureSet(page: Page, systemId: string, title: string, authors: string, rows: number[][]) {
  const lit = await call(page.request, 'post', '/api/data-sets', {
    systemId,
    title,
    nominalPressurePa: 101325,
    origin: 'literature',
    citation: {
      authors,
      title: 'Vapour-liquid equilibrium of two alkanes',
      source: 'Journal of Invented Data',
      year: 1987,
      table: 'Table 3',
    },
  })
  return call(page.request, 'post', `/api/data-sets/${lit.id}/points`, {
    rowVersion: lit.rowVersion,
    points: typed(rows),
  }).then((r) => ({ id: lit.id as string, rowVersion: r.rowVersion as number }))
}

/** Two screenshots of the page: desktop (1280 px) and tablet (768 px) width. */
async function snapBoth(page: Page, name: string) {
  await snap(page, `${name}-desktop`)
  await page.setViewportSize({ width: 768, height: 1000 })
  await page.waitForTimeout(400)
  await snap(page, `${name}-768`)
  await page.setViewportSize({ width: 1280, height: 800 })
}

test('a run file with pure-component samples and a check standard: exact ends, the check kept apart', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  await page.goto('/datasets')
  await page.getByTestId('new-dataset').click()
  await page.getByLabel('Title').fill('Pure boiling points and a check')
  await page.getByLabel('Binary system').fill('acetone')
  await page.getByRole('option', { name: /acetone \/ methanol/ }).click()
  await page.getByTestId('create-dataset').click()
  const dialog = page.getByTestId('upload-dialog')
  await expect(dialog).toBeVisible()
  await dialog.getByTestId('upload-kind').getByText('Run file').click()
  await dialog
    .getByTestId('file-input')
    .setInputFiles(path.join('docs/examples', 'run-acetone-methanol-pure-and-checks.csv'))
  await expect(dialog.getByTestId('preview-samples')).toContainText('PURE-METHANOL')
  await expect(dialog.getByTestId('preview-pure')).toHaveCount(2)
  await expect(dialog.locator('td[data-problem="error"]')).toHaveCount(0)
  const pureRow = dialog.getByTestId('preview-samples').locator('tbody tr').filter({ hasText: 'PURE-ACETONE' })
  await expect(pureRow).toContainText('1.0000')
  await expect(dialog.getByTestId('preview-checks')).toContainText('CHK-0.5')
  await snap(page, 'lab-49-run-preview-pure-and-check')
  if (await dialog.getByTestId('ack-warnings').count()) await dialog.getByText(/I have checked the/).click()
  await dialog.getByTestId('commit-upload').click()
  await expect(dialog).toBeHidden()
  // two pure samples and one mixture become points; the check standard does not
  await expect(page.getByTestId('points-table').locator('tbody tr')).toHaveCount(3)
})

test('check standards run with a GC file go on the method’s control chart, the far one marked', async ({ page }) => {
  await signIn(page, DEMO.analyst)
  // a draft of its own on the open draft's system, which has one active calibration
  const openDraft = await draftId(page, OPEN_DRAFT)
  const open = await call(page.request, 'get', `/api/data-sets/${openDraft.id}`)
  const cal = await call(page.request, 'get', `/api/calibrations/${open.points[0].calibrationId}`)
  const d = await call(page.request, 'post', '/api/data-sets', {
    systemId: openDraft.systemId,
    title: 'Check standards of the day',
    nominalPressurePa: 101325,
  })
  const methods = await call(page.request, 'get', '/api/gc-methods')
  const method = methods.items.find((m: { id: string }) => m.id === cal.gcMethodId)
  // Five readings of one check standard close together, the sixth far off (invented areas).
  const areas = [100000, 100300, 99800, 100100, 99900, 160000]
  const csv = [
    'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit,check_x1',
    // the far one's label carries markup: it must show as text
    ...areas.map(
      (a, i) => `CHK-${i + 1}${i === 5 ? ' <img src=x onerror=window.__owned=1>' : ''},check,1,${a},100000,,,,,0.5`,
    ),
  ].join('\n')
  const up = await page.request.post(`/api/data-sets/${d.id}/uploads`, {
    headers: { Origin: baseURL },
    multipart: {
      file: { name: 'check-standards.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) },
      rowVersion: String(d.rowVersion),
      acceptWarnings: 'true',
    },
  })
  expect(up.status(), await up.text()).toBe(201)

  await page.goto('/checks')
  const section = page.getByTestId('gc-check-standards')
  await section.getByTestId('gc-check-method').click()
  await page.getByRole('option', { name: method.name, exact: true }).click()
  await expect(section.getByTestId('control-chart')).toBeVisible()
  // with all six as the reference period the far one widens the limits itself; the lab sets the first five
  await expect(section.getByTestId('control-alarms')).toHaveCount(0)
  await section.getByTestId('gc-check-baseline').locator('input').fill('5')
  await section.getByTestId('gc-check-baseline').locator('input').press('Tab')
  await expect(section.getByTestId('control-alarms')).toContainText('CHK-6')
  await expect(section.getByTestId('control-alarms')).toContainText('one result beyond the 3σ limit')
  await expect(section.getByTestId('control-alarms')).not.toContainText('CHK-1 ')
  await section.locator('summary').click()
  await expect(section.getByTestId('gc-check-table').locator('tbody tr')).toHaveCount(6)
  await expect(section.getByTestId('gc-check-table').locator('tbody tr.out')).toHaveCount(1)
  await expect(section.getByTestId('gc-check-table')).toContainText('CHK-6 <img src=x onerror=window.__owned=1>')
  await expect(section.locator('img')).toHaveCount(0)
  expect(await page.evaluate(() => (window as unknown as { __owned?: number }).__owned)).toBeUndefined()
  await section.scrollIntoViewIfNeeded()
  await snapBoth(page, 'lab-50-gc-check-standards')
})

test('literature data are drawn beside the lab’s own on the plots of the system, named as text', async ({ page }) => {
  await signIn(page, DEMO.analyst)
  const approved = await draftId(page, APPROVED_TO_REVISE)
  await literatureSet(page, approved.systemId, 'Comparison table', '<i>Invented</i>, B. Other', [
    HEXANE_HEPTANE[1],
    HEXANE_HEPTANE[4],
    HEXANE_HEPTANE[7],
  ])
  // the lab's own approved series of the same system shows the literature set beside its points
  await page.goto(`/datasets/${approved.id}`)
  await expect(page.getByRole('heading', { level: 1, name: APPROVED_TO_REVISE })).toBeVisible({ timeout: 30_000 })
  const note = page.getByTestId('literature-note')
  await expect(note).toContainText('<i>Invented</i> et al. 1987 (literature), 3 points')
  await expect(note.locator('i')).toHaveCount(0)
  await page.getByTestId('txy-plot').scrollIntoViewIfNeeded()
  await snapBoth(page, 'lab-51-literature-beside-own-data')
})

test('where to measure next: a range at a dilute end, a distance from the points, marks on both plots', async ({
  page,
}) => {
  await signIn(page, DEMO.analyst)
  const { systemId } = await draftId(page, APPROVED_TO_REVISE)
  const title = 'Alkane table for planning: n-hexane/n-heptane at 1 atm'
  const d = await literatureSet(page, systemId, title, 'C. Planner', HEXANE_HEPTANE)
  // several fits, so the residual legends hold many entries (they must show without paging)
  await call(page.request, 'post', `/api/data-sets/${d.id}/fits`, {
    models: ['margules', 'van-laar', 'wilson', 'nrtl'],
  })
  for (const nrtl of [{ alpha: 0.2 }, { alpha: 0.47 }, { fitAlpha: true }])
    await call(page.request, 'post', `/api/data-sets/${d.id}/fits`, { models: ['nrtl'], ...nrtl })
  await page.goto(`/datasets/${d.id}`)
  // six fits' curves are computed in the browser: on a busy machine the first paint can take a while
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible({ timeout: 30_000 })
  const panel = page.getByTestId('uncertainty-panel')
  await panel.getByTestId('suggestion-range').click()
  await page.getByRole('option', { name: 'Little component 2 (x₁ 0.85–1)' }).click()
  await expect(panel).toContainText('searching x₁ = 0.85–1.00')
  const items = panel.getByTestId('next-compositions').locator('li')
  await expect(items.first()).toBeVisible()
  for (const text of await items.allInnerTexts()) {
    const x = Number(/x₁ = ([\d.]+)/.exec(text)![1])
    expect(x).toBeGreaterThanOrEqual(0.85)
  }
  await expect(page.getByTestId('xy-suggested')).toContainText('1: x₁ = 0.')
  // a range with no room left: the server's note says so
  await panel.getByTestId('suggestion-range').click()
  await page.getByRole('option', { name: 'From … to …' }).click()
  await panel.getByTestId('suggestion-exclusion').locator('input').fill('0.5')
  await panel.getByTestId('suggestion-exclusion').locator('input').press('Tab')
  await expect(panel.getByTestId('suggestion-note').first()).toContainText('widen the range or shorten the distance')
  await panel.getByTestId('suggestion-exclusion').locator('input').fill('0.02')
  await panel.getByTestId('suggestion-exclusion').locator('input').press('Tab')
  await expect(panel.getByTestId('next-compositions').locator('li').first()).toBeVisible()
  await expect(panel).not.toContainText('widen the range or shorten the distance')
  // every fit is in the residual legends at once: a plain legend, no paging arrows
  await expect(page.getByTestId('residual-t')).toBeVisible()
  await snapBoth(page, 'lab-52-measure-next-and-fit-table')
  // a chosen point's details get a wider side column
  await page.getByTestId('points-table').locator('tbody tr').filter({ hasText: 'L3' }).click()
  await expect(page.getByTestId('point-details')).toContainText('Point 3 · L3')
  const box = await page.getByTestId('point-details').boundingBox()
  expect(box!.width).toBeGreaterThan(340)
  await page.getByTestId('point-details').scrollIntoViewIfNeeded()
  await snap(page, 'lab-53-point-details-desktop')
})
