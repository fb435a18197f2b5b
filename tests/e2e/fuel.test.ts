// A fuel conversion in the browser: the editor offers the fuel parts (not the coolant ones) for a fuel
// circuit and the coolant parts for its neighbour in the same project; the return-style conversion
// shows no-return-line until the return hose is drawn from the regulator to the tank's bulkhead, and
// then the check has no error and the pump and injector verdicts stand. Screenshots in
// tests/screenshots/fuel-*.png are for people to look at.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { fuelDemoDocument } from '#shared/demo'
import { baseUrl, signUp } from '../helpers/http'
import { hydrated, launchBrowser, newContext, screenshotDir } from '../helpers/browser'

interface EditorState {
  parts: number; hoses: number; selection: string[]; readOnly: boolean; analysing: boolean; reportSeq: number; current: boolean
  findings: Array<{ code: string; severity: string; ids: string[] }>
}
interface ViewState { ports: Record<string, [number, number]> }

let browser: Browser
beforeAll(async () => { browser = await launchBrowser() })
afterAll(async () => { await browser?.close() })

const editorState = async (page: Page): Promise<EditorState> => JSON.parse((await page.getByTestId('editor-state').textContent()) || '{}')
const viewState = async (page: Page): Promise<ViewState> => JSON.parse((await page.getByTestId('view-state-side').textContent()) || '{}')

async function shot(page: Page, name: string) {
  await page.waitForTimeout(200)
  mkdirSync(screenshotDir, { recursive: true })
  await page.screenshot({ path: join(screenshotDir, `${name}.png`) })
}

async function settled(page: Page, after: number) {
  await expect.poll(async () => { const s = await editorState(page); return s.reportSeq > after && s.current && !s.analysing }, { timeout: 10_000 }).toBe(true)
  return editorState(page)
}

async function portOnSide(page: Page, portId: string) {
  await page.waitForTimeout(250) // the view's summary follows changes after a short pause
  const box = (await page.getByTestId('canvas-side').boundingBox())!
  const at = (await viewState(page)).ports[portId]
  if (!at) throw new Error(`${portId} is not on the side view`)
  return { x: box.x + at[0], y: box.y + at[1] }
}

async function drag(page: Page, from: { x: number; y: number }, to: { x: number; y: number }) {
  await page.mouse.move(from.x, from.y)
  await page.mouse.down()
  for (let i = 1; i <= 12; i++) await page.mouse.move(from.x + ((to.x - from.x) * i) / 12, from.y + ((to.y - from.y) * i) / 12)
  await page.mouse.up()
}

const codesOf = (s: EditorState) => s.findings.map((f) => f.code)

describe('a fuel conversion in the editor', () => {
  it('shows no-return-line on a return-style conversion until the return is drawn', async () => {
    const { client } = await signUp('fuelfab')
    const project = await client.post('/api/projects', { title: 'Pickup, injected six', vehicle: 'Pickup', engine: 'Injected six', status: 'fabrication' })
    expect(project.status).toBe(201)
    const coolant = await client.post(`/api/projects/${project.body.id}/circuits`, { kind: 'coolant', title: 'Engine cooling' })
    const fuel = await client.post(`/api/projects/${project.body.id}/circuits`, { kind: 'fuel', title: 'Fuel conversion' })
    expect([coolant.status, fuel.status]).toEqual([201, 201])
    // the conversion as the fabricator has drawn it so far: tank, pump, filter, rail, regulator; no return yet
    const graph = (await client.get(`/api/circuits/${fuel.body.id}/graph`)).body
    const saved = await client.put(`/api/circuits/${fuel.body.id}/graph`, { baseVersion: graph.circuit.version, document: fuelDemoDocument() })
    expect(saved.status).toBe(200)
    // both kinds side by side in one project
    const detail = (await client.get(`/api/projects/${project.body.id}`)).body
    expect(detail.circuits.map((c: { kind: string }) => c.kind).sort()).toEqual(['coolant', 'fuel'])

    const context = await newContext(browser, baseUrl)
    await context.addCookies([...client.cookies].map(([name, value]) => ({ name, value, url: baseUrl })))
    const page = await context.newPage()

    // the coolant circuit's palette has coolant parts only
    await page.goto(`/circuits/${coolant.body.id}`)
    await hydrated(page)
    await expect.poll(() => page.getByTestId('place-radiator').count(), { timeout: 15_000 }).toBe(1)
    expect(await page.getByTestId('place-fuel-tank').count()).toBe(0)

    await page.goto(`/circuits/${fuel.body.id}`)
    await hydrated(page)
    await expect.poll(() => page.getByTestId('view-state-side').textContent(), { timeout: 15_000 }).toContain('viewport')
    // the fuel palette: fuel parts and the shared fittings, no radiator
    await expect.poll(() => page.getByTestId('place-fuel-regulator').count()).toBe(1)
    expect(await page.getByTestId('place-radiator').count()).toBe(0)
    expect(await page.getByTestId('place-tee').count()).toBe(1)
    await expect.poll(() => page.getByTestId('palette').getAttribute('data-kind')).toBe('fuel')

    let state = await settled(page, 0)
    expect(codesOf(state)).toContain('no-return-line')
    expect(state.findings.find((f) => f.code === 'no-return-line')!.ids).toContain('regulator')
    await expect.poll(() => page.getByTestId('findings').textContent()).toContain('return-style regulator')
    await expect.poll(() => page.getByTestId('fuel-pump-verdict').textContent()).toContain('enough')
    await shot(page, 'fuel-no-return')

    // draw the return: from the regulator's return port to the bulkhead through the tank top
    const seq = state.reportSeq
    await drag(page, await portOnSide(page, 'regulator-return'), await portOnSide(page, 'return-bulkhead-spigot'))
    await expect.poll(async () => (await editorState(page)).hoses).toBe(4)
    state = await settled(page, seq)
    expect(codesOf(state)).not.toContain('no-return-line')
    expect(state.findings.filter((f) => f.severity === 'error')).toEqual([])
    await expect.poll(() => page.getByTestId('findings').textContent()).not.toContain('return-style regulator')
    await expect.poll(() => page.getByTestId('fuel-injector-verdict').textContent()).toContain('enough')
    await shot(page, 'fuel-return-drawn')
    await context.close()
  })
})
