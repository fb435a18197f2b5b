// Drawing a circuit in the browser: parts from the palette, hoses dragged port to port, the engine's
// findings on the drawing, a one-key port blank, a hose bent above the filler in the side view, undo
// and redo. The editor's hidden summaries (data-testid editor-state / view-state-*) tell the test
// what is drawn where; the screenshots in tests/screenshots/editor-*.png are for people to look at.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, signUp } from '../helpers/http'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { hydrated, launchBrowser, newContext, screenshotDir } from '../helpers/browser'

interface EditorState {
  parts: number; hoses: number; selection: string[]; readOnly: boolean; analysing: boolean; reportSeq: number; current: boolean
  findings: Array<{ code: string; severity: string; ids: string[] }>; highlighted: string[] | number; canUndo: boolean; canRedo: boolean
}
interface ViewState {
  parts: Record<string, [number, number]>; ports: Record<string, [number, number]>; hoses: Record<string, Array<[number, number]>>
}

/**
 * A screenshot of the window as the user sees it. Not full-page: the editor fills the window, and a
 * full-page capture would stretch the window to the page's height and catch the views mid-resize.
 */
async function shot(page: Page, name: string) {
  await page.waitForTimeout(200)
  mkdirSync(screenshotDir, { recursive: true })
  await page.screenshot({ path: join(screenshotDir, `${name}.png`) })
}

let browser: Browser
beforeAll(async () => { browser = await launchBrowser() })
afterAll(async () => { await browser?.close() })

const editorState = async (page: Page): Promise<EditorState> => JSON.parse((await page.getByTestId('editor-state').textContent()) || '{}')
const viewState = async (page: Page, view: 'side' | 'top'): Promise<ViewState> => JSON.parse((await page.getByTestId(`view-state-${view}`).textContent()) || '{}')

/** Waits until the engine has answered for the latest change (a report newer than `after`, for the current document). */
async function settled(page: Page, after: number) {
  await expect.poll(async () => { const s = await editorState(page); return s.reportSeq > after && s.current && !s.analysing }, { timeout: 10_000 }).toBe(true)
  return editorState(page)
}

/** A point of a view in page coordinates from the view's own summary. */
async function onView(page: Page, view: 'side' | 'top', pick: (v: ViewState) => [number, number] | undefined) {
  await page.waitForTimeout(250) // the summary follows changes after a short pause
  const box = (await page.getByTestId(`canvas-${view}`).boundingBox())!
  const at = pick(await viewState(page, view))
  if (!at) throw new Error('not on the view')
  return { x: box.x + at[0], y: box.y + at[1] }
}

async function drag(page: Page, from: { x: number; y: number }, to: { x: number; y: number }) {
  await page.mouse.move(from.x, from.y)
  await page.mouse.down()
  for (let i = 1; i <= 12; i++) await page.mouse.move(from.x + ((to.x - from.x) * i) / 12, from.y + ((to.y - from.y) * i) / 12)
  await page.mouse.up()
}

const openPortsOn = (s: EditorState, portId: string) => s.findings.filter((f) => f.code === 'open-port' && f.ids.includes(portId)).length

describe('the circuit editor in the browser', () => {
  it('places parts, joins ports, shows and fixes findings, bends a hose above the filler, undoes and redoes', async () => {
    const { client } = await signUp('editor')
    const project = await client.post('/api/projects', { title: 'Panel van, transplanted four', vehicle: 'Panel van', engine: 'Turbo four', status: 'fabrication' })
    expect(project.status).toBe(201)
    const circuit = await client.post(`/api/projects/${project.body.id}/circuits`, { kind: 'coolant', title: 'Engine cooling' })
    expect(circuit.status).toBe(201)

    const context = await newContext(browser, baseUrl)
    await context.addCookies([...client.cookies].map(([name, value]) => ({ name, value, url: baseUrl })))
    const page = await context.newPage()
    await page.goto(`/circuits/${circuit.body.id}`)
    await hydrated(page)
    await expect.poll(() => page.getByTestId('view-state-side').textContent(), { timeout: 15_000 }).toContain('viewport')
    await shot(page, 'editor-empty')

    // parts dropped from the palette where they go in the side view (x fore–aft, z up)
    const side = (await page.getByTestId('canvas-side').boundingBox())!
    const spot = (fx: number, fy: number) => ({ targetPosition: { x: side.width * fx, y: side.height * fy } })
    const canvasSide = page.getByTestId('view-side')
    await page.getByTestId('place-engine').dragTo(canvasSide, spot(0.72, 0.62))
    await page.getByTestId('place-radiator').dragTo(canvasSide, spot(0.14, 0.6))
    await page.getByTestId('place-thermostat').dragTo(canvasSide, spot(0.45, 0.45))
    await page.getByTestId('place-pressure-cap').dragTo(canvasSide, spot(0.3, 0.3))
    await page.getByTestId('place-water-pump').dragTo(canvasSide, spot(0.5, 0.85))
    await expect.poll(async () => (await editorState(page)).parts).toBe(5)
    let state = await settled(page, 0)
    // a fresh engine has three ports, all open
    for (const p of ['engine-1-head-outlet', 'engine-1-block-inlet', 'engine-1-heater-outlet']) expect(openPortsOn(state, p)).toBe(1)
    await shot(page, 'editor-parts')

    // join two engine ports: head outlet → thermostat, pump outlet → block inlet
    let seq = state.reportSeq
    await drag(page, await onView(page, 'side', (v) => v.ports['engine-1-head-outlet']), await onView(page, 'side', (v) => v.ports['thermostat-1-engine-side']))
    await drag(page, await onView(page, 'side', (v) => v.ports['water-pump-1-outlet']), await onView(page, 'side', (v) => v.ports['engine-1-block-inlet']))
    await expect.poll(async () => (await editorState(page)).hoses).toBe(2)
    state = await settled(page, seq)
    expect(openPortsOn(state, 'engine-1-head-outlet')).toBe(0)
    expect(openPortsOn(state, 'engine-1-block-inlet')).toBe(0)
    expect(openPortsOn(state, 'engine-1-heater-outlet')).toBe(1) // the third port is reported …
    expect(state.highlighted).toContain('engine-1-heater-outlet') // … and marked on the drawing
    await expect.poll(() => page.getByTestId('findings').textContent()).toContain('heater outlet')
    await shot(page, 'editor-open-port')

    // select the third port on the drawing and blank it from the toolbar
    const third = await onView(page, 'side', (v) => v.ports['engine-1-heater-outlet'])
    await page.mouse.click(third.x, third.y)
    await expect.poll(async () => (await editorState(page)).selection).toEqual(['engine-1-heater-outlet'])
    seq = state.reportSeq
    await page.getByTestId('tool-blank-port').click()
    state = await settled(page, seq)
    expect(openPortsOn(state, 'engine-1-heater-outlet')).toBe(0)
    expect(state.highlighted).not.toContain('engine-1-heater-outlet')
    await shot(page, 'editor-blanked')

    // the keyboard and touch way to run a hose: pick two ports (Shift adds to the selection), then Join ports
    const statOut = await onView(page, 'side', (v) => v.ports['thermostat-1-radiator-side'])
    const radIn = await onView(page, 'side', (v) => v.ports['radiator-1-top-inlet'])
    await page.mouse.click(statOut.x, statOut.y)
    await page.keyboard.down('Shift')
    await page.mouse.click(radIn.x, radIn.y)
    await page.keyboard.up('Shift')
    await expect.poll(async () => (await editorState(page)).selection.sort()).toEqual(['radiator-1-top-inlet', 'thermostat-1-radiator-side'])
    await page.getByTestId('tool-join').click()
    await expect.poll(async () => (await editorState(page)).hoses).toBe(3)

    // bend the engine → thermostat hose: a bend point at its middle, dragged up above the cap
    const hoseId = 'hose-1' // the first hose drawn: head outlet → thermostat
    const hosePoints = (await viewState(page, 'side')).hoses[hoseId]!
    const mid = await onView(page, 'side', () => [(hosePoints[0]![0] + hosePoints[1]![0]) / 2, (hosePoints[0]![1] + hosePoints[1]![1]) / 2])
    await page.mouse.dblclick(mid.x, mid.y)
    await expect.poll(async () => (await viewState(page, 'side')).hoses[hoseId]!.length).toBe(3)
    const cap = await onView(page, 'side', (v) => v.ports['pressure-cap-1-cap'])
    seq = (await editorState(page)).reportSeq
    await drag(page, mid, { x: mid.x, y: cap.y - 60 })
    state = await settled(page, seq)
    const codes = state.findings.map((f) => f.code)
    expect(codes).toContain('air-trap')
    expect(codes).toContain('fill-not-highest')
    expect(state.highlighted).toContain(hoseId)
    await shot(page, 'editor-air-trap')

    // undo takes the bend back down (the hump and its findings go); redo brings them back
    seq = state.reportSeq
    await page.getByTestId('tool-undo').click()
    state = await settled(page, seq)
    expect(state.findings.map((f) => f.code)).not.toContain('air-trap')
    expect(state.canRedo).toBe(true)
    await shot(page, 'editor-undone')
    seq = state.reportSeq
    await page.keyboard.press('Control+Shift+Z')
    state = await settled(page, seq)
    expect(state.findings.map((f) => f.code)).toContain('air-trap')

    // keyboard: select the engine, nudge it up in the side view (Shift: 10 mm a press), undo with Ctrl+Z
    const engine = await onView(page, 'side', (v) => v.parts['engine-1'])
    await page.mouse.click(engine.x, engine.y)
    await expect.poll(async () => (await editorState(page)).selection).toEqual(['engine-1'])
    const before = (await viewState(page, 'side')).parts['engine-1']!
    const plan = (await viewState(page, 'top')).parts['engine-1']!
    for (let i = 0; i < 5; i++) await page.keyboard.press('Shift+ArrowUp')
    await expect.poll(async () => (await viewState(page, 'side')).parts['engine-1']![1]).toBeLessThan(before[1])
    expect((await viewState(page, 'top')).parts['engine-1']).toEqual(plan) // height does not show on the top view
    await page.keyboard.press('Control+z')
    await expect.poll(async () => (await viewState(page, 'side')).parts['engine-1']![1]).toBe(before[1])
    await shot(page, 'editor-keyboard')
    await context.close()
  })

  it('shows a reviewer the same drawing, findings and flow without editing tools', async () => {
    const context = await newContext(browser, baseUrl)
    const page = await context.newPage()
    await page.goto('/sign-in')
    await hydrated(page)
    await page.getByLabel('E-mail').fill('reviewer@quillfeather.test')
    await page.getByLabel('Password').fill('hosewright-demo')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL((u) => u.pathname === '/')
    const projects = await (await page.request.get('/api/projects')).json()
    const demo = projects.items.find((p: { title: string }) => p.title.includes('Camper van'))
    const detail = await (await page.request.get(`/api/projects/${demo.id}`)).json()
    await page.goto(`/circuits/${detail.circuits[0].id}`)
    await hydrated(page)
    await expect.poll(async () => (await editorState(page)).readOnly, { timeout: 15_000 }).toBe(true)
    const state = await editorState(page)
    expect(state.findings.map((f) => f.code)).toContain('open-port') // the demo's deliberate third outlet
    await expect.poll(() => page.getByTestId('tool-undo').count()).toBe(0)
    await expect.poll(() => page.getByTestId('place-engine').count()).toBe(0)
    await page.getByTestId('tool-flow').selectOption('open')
    await page.waitForTimeout(300)
    await shot(page, 'editor-reviewer-flow')
    // dragging a part pans instead of moving it
    const part = await onView(page, 'side', (v) => v.parts.radiator)
    await drag(page, part, { x: part.x + 80, y: part.y })
    expect((await editorState(page)).canUndo).toBe(false)
    await context.close()
  })
})
