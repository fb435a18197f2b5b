// Editing in the inspector and saving that loses nothing: exact unit conversion on entry, autosave,
// offline changes kept in the browser and restored, two people saving the same circuit, leaving guards.
import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { APIRequestContext, Browser, BrowserContext, Page } from 'playwright-core'
import { demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { baseUrl, goodPassword, uniqueEmail } from '../helpers/http'
import { hydrated, launchBrowser, newContext, shot } from '../helpers/browser'

let browser: Browser
let circuitId: string
const email = uniqueEmail('editor-saving')
// one address per run, so the sign-in counters of other suites are not touched
const forwardedFor = `10.77.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`

async function signedInContext(create: boolean): Promise<BrowserContext> {
  const context = await newContext(browser, baseUrl)
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': forwardedFor })
  const res = create
    ? await context.request.post('/api/account', { data: { name: 'Saving Tester', email, password: goodPassword, workshopName: 'Saving test shop' } })
    : await context.request.post('/api/session', { data: { email, password: goodPassword } })
  expect(res.status(), await res.text()).toBeLessThan(300)
  return context
}

async function graph(request: APIRequestContext): Promise<{ circuit: { version: number }; document: CircuitDocument }> {
  const res = await request.get(`/api/circuits/${circuitId}/graph`)
  expect(res.status()).toBe(200)
  return await res.json()
}
const hoseOf = (doc: CircuitDocument, id: string) => doc.circuit.hoses.find((h) => h.id === id)!

async function openEditor(page: Page) {
  await page.goto(`/circuits/${circuitId}`)
  await hydrated(page)
  await page.getByTestId('inspector').waitFor()
  await expect.poll(() => page.getByTestId('save-state').getAttribute('data-state')).toBe('saved')
}

/** From the open-port finding to the engine, to its heater outlet, to the hose on it: the inspector's own links. */
async function selectHeaterFeed(page: Page) {
  await page.getByTestId('findings').locator('[data-code="open-port"] [data-finding]').first().click()
  await expect.poll(() => page.getByTestId('inspector-title').textContent()).toContain('third outlet')
  await page.getByRole('button', { name: /^on Engine/ }).click()
  await page.getByRole('button', { name: 'Edit port heater outlet' }).click()
  await page.getByRole('button', { name: 'Heater feed' }).click()
  await expect.poll(() => page.getByTestId('inspector-title').textContent()).toBe('Heater feed')
}

async function typeInto(page: Page, label: string, text: string) {
  const input = page.getByLabel(label, { exact: true })
  await input.fill(text)
  await input.press('Enter')
}

const saveState = (page: Page) => page.getByTestId('save-state').getAttribute('data-state')

beforeAll(async () => {
  browser = await launchBrowser()
  const owner = await signedInContext(true)
  // lengths in inches: what is typed is converted at 25.4 mm/in exactly (international inch, 1959)
  expect((await owner.request.patch('/api/account', { data: { preferences: { length: 'in' } } })).status()).toBe(200)
  const project = await (await owner.request.post('/api/projects', { data: { title: 'Saving test build' } })).json()
  const circuit = await (await owner.request.post(`/api/projects/${project.id}/circuits`, { data: { kind: 'coolant', title: 'Cooling' } })).json()
  circuitId = circuit.id
  const doc = demoDocument()
  doc.circuit.title = 'Cooling'
  const saved = await owner.request.put(`/api/circuits/${circuitId}/graph`, { data: { baseVersion: 1, document: doc } })
  expect(saved.status()).toBe(200)
  await owner.close()
})
afterAll(async () => { await browser?.close() })

describe('editing in the inspector and saving', () => {
  it('stores a length typed in inches as exact millimetres, keeps bad text with its message, and persists', async () => {
    const context = await signedInContext(false)
    const page = await context.newPage()
    await openEditor(page)
    await selectHeaterFeed(page)

    // bad text stays in the field with the reason, and nothing is committed
    await typeInto(page, 'Measured length', '12 furlongs')
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Type a number in in' }).count()).toBe(1)
    expect(await page.getByLabel('Measured length', { exact: true }).inputValue()).toBe('12 furlongs')
    expect(await saveState(page)).toBe('saved')
    // out of the model's range: the zod message, with the limit in the user's unit
    await typeInto(page, 'Measured length', '2000')
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Must be at most 50000 mm' }).textContent()).toContain('1968.50 in')
    await shot(page, 'editor-saving-field-error')

    await typeInto(page, 'Measured length', '157.5')
    await expect.poll(() => saveState(page)).not.toBe('saved')
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('saved')
    // 157.5 in × 25.4 mm/in = 4000.5 mm exactly
    expect(hoseOf((await graph(context.request)).document, 'hose-heater-feed').measuredLengthMm).toBe(4000.5)
    await shot(page, 'editor-saving-saved')

    await page.reload()
    await openEditor(page)
    await selectHeaterFeed(page)
    expect(await page.getByLabel('Measured length', { exact: true }).inputValue()).toBe('157.5')
    await context.close()
  })

  it('keeps a change made offline in the browser, asks before leaving, and saves it when reopened online', async () => {
    const context = await signedInContext(false)
    const page = await context.newPage()
    await openEditor(page)
    await selectHeaterFeed(page)
    await context.setOffline(true)
    await typeInto(page, 'Measured length', '160')
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('offline')
    await shot(page, 'editor-saving-offline')

    // leaving for another page of the app asks first; staying keeps the change
    const asked: string[] = []
    page.on('dialog', (d) => {
      asked.push(d.type())
      void d.dismiss()
    })
    await page.getByRole('link', { name: 'Saving test build' }).click()
    await expect.poll(() => asked).toContain('confirm')
    expect(new URL(page.url()).pathname).toBe(`/circuits/${circuitId}`)
    // closing the tab asks too (the browser's own prompt)
    await page.close({ runBeforeUnload: true })
    await expect.poll(() => asked).toContain('beforeunload')
    expect(page.isClosed()).toBe(false)
    await page.close()

    await context.setOffline(false)
    const again = await context.newPage()
    await again.goto(`/circuits/${circuitId}`)
    await hydrated(again)
    await expect.poll(() => again.getByTestId('draft-notice').textContent()).toContain('Restored your unsaved changes from')
    await expect.poll(() => saveState(again), { timeout: 10_000 }).toBe('saved')
    await shot(again, 'editor-saving-restored')
    // 160 in × 25.4 = 4064 mm
    expect(hoseOf((await graph(context.request)).document, 'hose-heater-feed').measuredLengthMm).toBe(4064)
    expect(await again.evaluate((id) => localStorage.getItem(`hosewright:draft:${id}`), circuitId)).toBeNull()
    await context.close()
  })

  it('two people save the same circuit: the second chooses, and both versions stay recoverable', async () => {
    const first = await signedInContext(false)
    const second = await signedInContext(false)
    const a = await first.newPage()
    const b = await second.newPage()
    await openEditor(a)
    await openEditor(b)
    const start = (await graph(first.request)).circuit.version

    // A changes the heater feed and saves first
    await selectHeaterFeed(a)
    await typeInto(a, 'Measured length', '150')
    await expect.poll(() => saveState(a), { timeout: 10_000 }).toBe('saved')
    expect((await graph(first.request)).circuit.version).toBe(start + 1)

    // B, still on the old version, renames the circuit: the save meets A's version
    await typeInto(b, 'Title', 'Cooling, second opinion')
    const dialog = b.getByTestId('conflict-dialog')
    await expect.poll(() => dialog.isVisible(), { timeout: 10_000 }).toBe(true)
    expect(await saveState(b)).toBe('conflict')
    const summary = await b.getByTestId('conflict-summary').textContent()
    // theirs has the new hose length, mine the new title: two things differ
    expect(summary).toBe('2 changed')
    expect(await dialog.textContent()).toContain('Heater feed')
    await shot(b, 'editor-saving-conflict')

    await b.getByRole('button', { name: 'Keep mine' }).click()
    await expect.poll(() => saveState(b), { timeout: 10_000 }).toBe('saved')
    const afterKeep = await graph(second.request)
    expect(afterKeep.circuit.version).toBe(start + 2)
    expect(afterKeep.document.circuit.title).toBe('Cooling, second opinion')
    // A's version is still in the history, with A's length
    const theirs = await (await first.request.get(`/api/circuits/${circuitId}/revisions/${start + 1}`)).json()
    expect(hoseOf(theirs.document, 'hose-heater-feed').measuredLengthMm).toBe(150 * 25.4)

    // now A is behind: A changes the wall, meets B's version and takes it
    await typeInto(a, 'Wall', '0.25')
    await expect.poll(() => a.getByTestId('conflict-dialog').isVisible(), { timeout: 10_000 }).toBe(true)
    await a.getByRole('button', { name: 'Take theirs' }).click()
    await expect.poll(() => saveState(a)).toBe('saved')
    await expect.poll(() => a.getByTestId('set-aside-notice').isVisible()).toBe(true)
    await shot(a, 'editor-saving-set-aside')
    const download = a.waitForEvent('download')
    await a.getByRole('button', { name: 'Download my version (JSON)' }).click()
    const mine = JSON.parse(readFileSync(await (await download).path(), 'utf8')) as CircuitDocument
    // 0.25 in = 6.35 mm
    expect(hoseOf(mine, 'hose-heater-feed').wallMm).toBe(6.35)
    const aside = await a.evaluate((id) => localStorage.getItem(`hosewright:draft:${id}:set-aside`), circuitId)
    expect(hoseOf(JSON.parse(aside!).document, 'hose-heater-feed').wallMm).toBe(6.35)
    // A sees B's title now, and nothing of A's was written to the server
    expect((await graph(first.request)).circuit.version).toBe(start + 2)
    await a.getByRole('button', { name: 'Dismiss' }).click()
    expect(await a.evaluate((id) => localStorage.getItem(`hosewright:draft:${id}:set-aside`), circuitId)).toBeNull()
    await first.close()
    await second.close()
  })

  it('a draft left on an older version opens the choice instead of being restored over a newer one', async () => {
    const context = await signedInContext(false)
    const page = await context.newPage()
    await openEditor(page)
    const server = await graph(context.request)
    const mine = structuredClone(server.document)
    mine.circuit.components.find((c) => c.id === 'heater')!.label = 'Cab heater core, left of the dash'
    await page.evaluate(({ id, draft }) => localStorage.setItem(`hosewright:draft:${id}`, JSON.stringify(draft)), {
      id: circuitId, draft: { circuitId, baseVersion: server.circuit.version - 1, document: mine, savedAt: new Date().toISOString() },
    })
    await page.reload()
    await hydrated(page)
    const dialog = page.getByTestId('conflict-dialog')
    await expect.poll(() => dialog.isVisible(), { timeout: 10_000 }).toBe(true)
    expect(await dialog.textContent()).toContain('Your unsaved changes are based on an older version')
    expect(await dialog.textContent()).toContain('Cab heater core, left of the dash')
    await page.getByRole('button', { name: 'Keep mine' }).click()
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('saved')
    const after = await graph(context.request)
    expect(after.circuit.version).toBe(server.circuit.version + 1)
    expect(after.document.circuit.components.find((c) => c.id === 'heater')!.label).toBe('Cab heater core, left of the dash')
    await context.close()
  })

  it('the one-click fix of a finding is one undo step, and the shortcut sheet lists the keys', async () => {
    const context = await signedInContext(false)
    const page = await context.newPage()
    await openEditor(page)
    const errors = () => page.getByTestId('finding-counts').first().locator('[data-severity="error"]').textContent()
    await expect.poll(errors).toContain('1')
    await page.getByTestId('findings').locator('[data-code="open-port"]').getByRole('button', { name: 'Fix' }).click()
    await expect.poll(errors, { timeout: 10_000 }).toContain('0')
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('saved')
    const fixed = (await graph(context.request)).document
    expect(fixed.circuit.components.find((c) => c.id === 'engine')!.ports.find((p) => p.id === 'engine-third')!.blocked).toBe(true)
    await page.getByRole('button', { name: 'Undo' }).click()
    await expect.poll(errors, { timeout: 10_000 }).toContain('1')
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('saved')

    await page.getByTestId('circuit-title').click()
    await page.keyboard.press('?')
    const sheet = page.getByTestId('shortcut-sheet')
    await expect.poll(() => sheet.isVisible()).toBe(true)
    expect(await sheet.textContent()).toContain('Ctrl + Shift + Z')
    await shot(page, 'editor-saving-shortcuts')
    await page.keyboard.press('Escape')
    await expect.poll(() => sheet.isVisible()).toBe(false)
    await context.close()
  })
})
