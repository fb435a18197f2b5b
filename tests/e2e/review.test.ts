// Once through the review before the first fill in the browser: the fabricator submits, the reviewer
// signs a warning off with a reason and is stopped by an error, asks for changes; the fabricator caps
// the outlet and submits again; the reviewer signs off and approves; the project page then leads the
// technician to the approved version.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { applyFix, type CircuitDocument } from '#shared/circuit'
import { demoDocument } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { Client, addMember, baseUrl, goodPassword, signUp } from '../helpers/http'
import { hydrated, launchBrowser, newContext, shot } from '../helpers/browser'

let browser: Browser
let owner: Client
let fabApi: Client
const people = {} as Record<'fab' | 'rev' | 'tech', { email: string; context: BrowserContext; page: Page }>
let projectId: string
let circuitId: string
const forwardedFor = `10.78.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`

async function signedIn(email: string) {
  const context = await newContext(browser, baseUrl)
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': forwardedFor })
  const res = await context.request.post('/api/session', { data: { email, password: goodPassword } })
  expect(res.status(), await res.text()).toBe(200)
  return { email, context, page: await context.newPage() }
}

async function open(page: Page, path: string) {
  await page.goto(path)
  await hydrated(page)
}

beforeAll(async () => {
  browser = await launchBrowser()
  const o = await signUp('e2erevowner', 'Browser review shop')
  owner = o.client
  const [f, r, t] = await Promise.all([addMember(owner, 'fabricator', 'e2efab'), addMember(owner, 'reviewer', 'e2erev'), addMember(owner, 'technician', 'e2etech')])
  fabApi = f.client
  people.fab = await signedIn(f.email)
  people.rev = await signedIn(r.email)
  people.tech = await signedIn(t.email)
  projectId = (await fabApi.post('/api/projects', { title: 'Browser review build' })).body.id
  circuitId = (await fabApi.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Cooling' })).body.id
  const doc = demoDocument()
  doc.circuit.title = 'Cooling'
  expect((await fabApi.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: doc })).status).toBe(200)
})
afterAll(async () => { await browser?.close() })

async function submitFromProjectPage(version: number, note: string) {
  const { page } = people.fab
  await open(page, `/projects/${projectId}`)
  const row = page.getByTestId('review-circuits').locator(`[data-circuit="${circuitId}"]`)
  await row.getByRole('button', { name: `Submit version ${version} for review` }).click()
  await row.getByLabel('Note for the reviewer (optional)').fill(note)
  await row.getByRole('button', { name: `Submit version ${version}`, exact: true }).click()
  await page.waitForURL(/\/reviews\//)
  await expect.poll(() => page.getByTestId('review-state').textContent()).toContain('In review')
  return page.url().split('/reviews/')[1]!
}

async function signOffWarning(page: Page, justification: string) {
  const warning = page.getByTestId('review-findings').locator('[data-code="air-trap"]')
  await warning.getByLabel('Why is this acceptable?').fill(justification)
  await warning.getByRole('button', { name: 'Sign off warning' }).click()
  await expect.poll(() => warning.getByTestId('acknowledgement').textContent()).toContain(justification)
}

describe('review in the browser', () => {
  it('fabricator submits, reviewer signs the warning off, is stopped by the error and asks for changes', async () => {
    const reviewId = await submitFromProjectPage(2, 'First drawing, heater loop as fitted.')
    const { page } = people.rev
    await open(page, `/reviews/${reviewId}`)
    await page.getByTestId('drawing-side').waitFor()
    // a short reason is refused on the spot
    const warning = page.getByTestId('review-findings').locator('[data-code="air-trap"]')
    await warning.getByLabel('Why is this acceptable?').fill('ok')
    await warning.getByRole('button', { name: 'Sign off warning' }).click()
    await expect.poll(() => warning.getByRole('alert').textContent()).toMatch(/at least 10 characters/)
    await signOffWarning(page, 'Heater core has its own bleed screw at the top.')
    expect(await page.getByTestId('approval-blocked').textContent()).toMatch(/1 error finding/)
    await page.getByRole('button', { name: 'Approve version 2' }).click()
    const alert = page.getByTestId('review-decision').getByRole('alert')
    await expect.poll(() => alert.textContent()).toMatch(/cannot be approved/)
    expect(await alert.textContent()).toContain('open-port')
    // a comment on the engine, mentioning the fabricator from the autocomplete
    await page.getByTestId('review-findings').locator('[data-code="open-port"] button').first().click()
    const box = page.getByTestId('comment-new')
    await box.fill('@e2ef')
    await page.getByRole('option', { name: /Test e2efab/ }).waitFor()
    await box.press('Enter')
    await box.pressSequentially('the third outlet needs a 16 mm blanking cap.')
    await page.getByRole('button', { name: 'Comment', exact: true }).click()
    await expect.poll(() => page.getByTestId('comment-panel').textContent()).toContain('@Test e2efab the third outlet needs a 16 mm blanking cap.')
    await expect.poll(() => page.locator('[data-comment-pin]').count()).toBe(2) // one pin on each view
    await shot(page, 'review-blocked')
    await page.getByLabel('Note to the fabricator').fill('Cap the third outlet, then submit again.')
    await page.getByRole('button', { name: 'Request changes' }).click()
    await expect.poll(() => page.getByTestId('review-state').textContent()).toContain('Changes requested')
    await shot(page, 'review-changes-requested')
  })

  it('fabricator caps the outlet and submits again; the reviewer signs off and approves', async () => {
    const graph = (await fabApi.get(`/api/circuits/${circuitId}/graph`)).body as { circuit: { version: number }; document: CircuitDocument }
    const openPort = analyzeCircuit(graph.document).findings.find(f => f.code === 'open-port')!
    const fixed = applyFix(graph.document, openPort.fix.action!).doc
    expect((await fabApi.put(`/api/circuits/${circuitId}/graph`, { baseVersion: graph.circuit.version, document: fixed })).status).toBe(200)
    const reviewId = await submitFromProjectPage(3, 'Outlet capped.')
    await shot(people.fab.page, 'review-submitted')
    const { page } = people.rev
    await open(page, `/projects/${projectId}`)
    await page.getByTestId('open-review-link').click()
    await page.waitForURL(new RegExp(`/reviews/${reviewId}`))
    await hydrated(page)
    await expect.poll(() => page.getByTestId('review-findings').locator('[data-code="open-port"]').count()).toBe(0)
    await signOffWarning(page, 'Heater core has its own bleed screw at the top.')
    await page.getByLabel('Note to the fabricator').fill('Good to fill.')
    await page.getByRole('button', { name: 'Approve version 3' }).click()
    await expect.poll(() => page.getByTestId('review-state').textContent()).toContain('Approved')
    await shot(page, 'review-approved')
  })

  it('the project page shows the approved version, and leads the technician to it first', async () => {
    // a later save is a draft: the approval stays on version 3
    const graph = (await fabApi.get(`/api/circuits/${circuitId}/graph`)).body
    graph.document.circuit.notes = 'Tank moved 20 mm rearwards.'
    expect((await fabApi.put(`/api/circuits/${circuitId}/graph`, { baseVersion: graph.circuit.version, document: graph.document })).status).toBe(200)

    const fab = people.fab.page
    await open(fab, `/projects/${projectId}`)
    await expect.poll(() => fab.getByTestId('review-status').first().textContent()).toContain('Approved: version 3')
    expect(await fab.getByTestId('review-circuits').textContent()).toContain('saved since as version 4 (a draft)')
    await shot(fab, 'review-project')

    const tech = people.tech.page
    await open(tech, `/projects/${projectId}`)
    expect(await tech.getByTestId('circuit-list').count()).toBe(0)
    const approved = tech.getByTestId('approved-link')
    expect(await approved.textContent()).toContain('approved version 3')
    await shot(tech, 'review-project-technician')
    await approved.click()
    await tech.waitForURL(/\/reviews\//)
    await hydrated(tech)
    await expect.poll(() => tech.getByTestId('review-title').textContent()).toContain('version 3')
    expect(await tech.getByRole('link', { name: 'Latest draft (version 4)' }).count()).toBe(1)
    expect(await tech.getByTestId('review-decision').count()).toBe(0)
    await shot(tech, 'review-technician')
  })
})
