// The content security policy in the browser: the editor draws, drags and analyses in its Web
// Worker with no violation reported, and hostile text typed by users shows as text and runs nothing.
// Violations are caught by a `securitypolicyviolation` listener installed before any page script.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, BrowserContext, Page, Worker } from 'playwright-core'
import { baseUrl, signUp, type Client } from '../helpers/http'
import { hydrated, launchBrowser, newContext, shot } from '../helpers/browser'

interface Violation { directive: string; blocked: string; sample: string; page: string }

let browser: Browser
beforeAll(async () => { browser = await launchBrowser() })
afterAll(async () => { await browser?.close() })

/** A signed-in page that records CSP violations, console errors and workers. */
async function watchedPage(client: Client) {
  const context: BrowserContext = await newContext(browser, baseUrl)
  await context.addCookies([...client.cookies].map(([name, value]) => ({ name, value, url: baseUrl })))
  // every page of the context reports here, so violations of earlier pages are kept too
  const seen: Violation[] = []
  await context.exposeBinding('__reportViolation', (_source, v: Violation) => { seen.push(v) })
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      const report = (window as unknown as { __reportViolation: (v: unknown) => void }).__reportViolation
      void report({ directive: e.violatedDirective, blocked: e.blockedURI, sample: e.sample, page: location.pathname })
    })
  })
  const page = await context.newPage()
  const consoleErrors: string[] = []
  page.on('console', (m) => { if (m.type() === 'error') consoleErrors.push(m.text()) })
  page.on('pageerror', (e) => consoleErrors.push(`uncaught: ${e.message}`))
  const workers: Array<{ worker: Worker; closed: boolean }> = []
  page.on('worker', (worker) => {
    const entry = { worker, closed: false }
    workers.push(entry)
    worker.on('close', () => { entry.closed = true })
  })
  const violations = async (): Promise<Violation[]> => {
    await page.waitForTimeout(100) // reports travel through the binding
    return seen
  }
  return { context, page, consoleErrors, workers, violations }
}

const editorState = async (page: Page) => JSON.parse((await page.getByTestId('editor-state').textContent()) || '{}')
const viewState = async (page: Page) => JSON.parse((await page.getByTestId('view-state-side').textContent()) || '{}')

async function drag(page: Page, from: { x: number; y: number }, to: { x: number; y: number }) {
  await page.mouse.move(from.x, from.y)
  await page.mouse.down()
  for (let i = 1; i <= 12; i++) await page.mouse.move(from.x + ((to.x - from.x) * i) / 12, from.y + ((to.y - from.y) * i) / 12)
  await page.mouse.up()
}

async function sideViewPoint(page: Page, pick: (v: any) => [number, number]) {
  await page.waitForTimeout(250) // the summary follows changes after a short pause
  const box = (await page.getByTestId('canvas-side').boundingBox())!
  const [x, y] = pick(await viewState(page))
  return { x: box.x + x, y: box.y + y }
}

describe('the editor under the content security policy', () => {
  it('draws, drags and analyses in the worker with no violation and no console error', async () => {
    const { client } = await signUp('csp')
    const projectId = (await client.post('/api/projects', { title: 'Policy check build' })).body.id
    const circuitId = (await client.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Policy cooling' })).body.id
    const w = await watchedPage(client)
    const { page } = w

    // into the editor by a client-side navigation: its chunks, styles and worker load after the first paint
    await page.goto(`/projects/${projectId}`)
    await hydrated(page)
    await page.getByRole('link', { name: 'Policy cooling' }).first().click()
    await page.waitForURL(new RegExp(`/circuits/${circuitId}`))
    await expect.poll(() => page.getByTestId('view-state-side').textContent(), { timeout: 15_000 }).toContain('viewport')
    const side = (await page.getByTestId('canvas-side').boundingBox())!
    const spot = (fx: number, fy: number) => ({ targetPosition: { x: side.width * fx, y: side.height * fy } })
    await page.getByTestId('place-engine').dragTo(page.getByTestId('view-side'), spot(0.7, 0.6))
    await page.getByTestId('place-thermostat').dragTo(page.getByTestId('view-side'), spot(0.4, 0.45))
    await expect.poll(async () => (await editorState(page)).parts).toBe(2)
    const first = await editorState(page)

    // a hose dragged port to port, then the engine dragged along
    await drag(page, await sideViewPoint(page, v => v.ports['engine-1-head-outlet']), await sideViewPoint(page, v => v.ports['thermostat-1-engine-side']))
    await expect.poll(async () => (await editorState(page)).hoses).toBe(1)
    const engineAt = await sideViewPoint(page, v => v.parts['engine-1'])
    await drag(page, engineAt, { x: engineAt.x + 60, y: engineAt.y - 30 })
    await expect.poll(async () => (await viewState(page)).parts['engine-1'][0]).not.toBe(engineAt.x - side.x)
    // the report moved on for the latest drawing
    await expect.poll(async () => { const s = await editorState(page); return s.reportSeq > first.reportSeq && s.current && !s.analysing }, { timeout: 10_000 }).toBe(true)
    await shot(page, 'csp-editor')

    // the analysis ran in a module worker from /_nuxt, and that worker is still alive
    const analysis = w.workers.filter(x => new URL(x.worker.url()).pathname.startsWith('/_nuxt/'))
    expect(analysis.length).toBeGreaterThanOrEqual(1)
    expect(analysis.every(x => !x.closed)).toBe(true)
    expect(await analysis[0]!.worker.evaluate(() => typeof postMessage)).toBe('function')

    expect(await w.violations()).toEqual([])
    expect(w.consoleErrors.filter(e => /content security policy|refused to/i.test(e))).toEqual([])
    expect(w.consoleErrors).toEqual([])
    await w.context.close()
  })
})

describe('hostile text in the browser', () => {
  it('a markup title and a script comment show as text and run nothing', async () => {
    const { client } = await signUp('xss')
    const title = '<img src=x onerror=window.__xss=1>'
    const projectId = (await client.post('/api/projects', { title, notes: '<script>window.__xss=2</script>' })).body.id
    const circuitTitle = '"><svg onload=window.__xss=3>'
    const circuitId = (await client.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: circuitTitle })).body.id
    const comment = '<script>window.__xss=4</script> {{ 7 * 7 }}'
    expect((await client.post(`/api/circuits/${circuitId}/comments`, { body: comment, version: 1 })).status).toBe(201)
    const w = await watchedPage(client)
    const { page } = w

    for (const path of ['/', `/projects/${projectId}`]) {
      await page.goto(path)
      await hydrated(page)
      await expect.poll(() => page.locator('body').innerText()).toContain(title)
    }
    await expect.poll(() => page.locator('body').innerText()).toContain(circuitTitle)
    await page.goto(`/circuits/${circuitId}`)
    await hydrated(page)
    await page.getByTestId('tab-comments').click()
    await expect.poll(() => page.getByTestId('comment-panel').innerText()).toContain(comment)
    await shot(page, 'csp-hostile-text')

    expect(await page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss)).toBeUndefined()
    expect(await page.locator('img[src="x"], svg[onload], script:not([src]):not([type="application/json"]):has-text("__xss")').count()).toBe(0)
    // escaped, not blocked: a policy violation here would mean markup reached the page
    expect(await w.violations()).toEqual([])
    await w.context.close()
  })
})
