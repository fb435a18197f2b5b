// Editor benchmark: npm run bench:editor
// Builds the app with HOSEWRIGHT_BUILD_TAG=bench when sources changed, starts it on its own port and
// database, saves a random circuit of about 1 000 parts and 1 300 hoses through the API, opens the
// editor in headless Chromium, and measures frame times (requestAnimationFrame in the page) while a
// part is dragged for 2 s, and while the side view is panned for 2 s (every element redrawn each
// frame). Prints medians and 95th percentiles, and the gzipped size of the JavaScript the editor page
// loads. Asserts nothing; the figures go into docs/performance.md ("Editor").
import { execFileSync, spawn, type ChildProcess } from 'node:child_process'
import { existsSync, openSync } from 'node:fs'
import { gzipSync } from 'node:zlib'
import { resolve } from 'node:path'
import { randomCircuit } from '../shared/demo'
import { nearestSegment, project, ViewScene } from '../shared/drawing'
import { launchBrowser, newContext } from '../tests/helpers/browser'

const root = resolve(import.meta.dirname, '..')
const port = Number(process.env.HOSEWRIGHT_BENCH_PORT ?? 3190)
const base = `http://127.0.0.1:${port}`
const sh = (script: string) => execFileSync('bash', ['-c', script], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] }).trim()

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN
  return sorted[Math.min(sorted.length - 1, Math.floor((sorted.length - 1) * p))]!
}

async function waitFor(check: () => Promise<boolean>, ms: number, what: string) {
  const end = Date.now() + ms
  while (Date.now() < end) {
    if (await check().catch(() => false)) return
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(`timed out waiting for ${what}`)
}

interface CpuProfile { nodes: Array<{ id: number; callFrame: { functionName: string; url: string; lineNumber: number } }>; samples: number[]; timeDeltas: number[] }

/** BENCH_PROFILE=1: the functions that took the most time during a measurement, by self time. */
function printProfile(profile: CpuProfile) {
  const byId = new Map(profile.nodes.map((n) => [n.id, n]))
  const self = new Map<string, number>()
  profile.samples.forEach((id, i) => {
    const f = byId.get(id)!.callFrame
    const key = `${f.functionName || '(anonymous)'} ${f.url.split('/').pop()}:${f.lineNumber}`
    self.set(key, (self.get(key) ?? 0) + (profile.timeDeltas[i] ?? 0) / 1000)
  })
  for (const [k, ms] of [...self].sort((a, b) => b[1] - a[1]).slice(0, 15)) console.log(`    ${ms.toFixed(1).padStart(8)} ms  ${k}`)
}

async function main() {
  console.log(`Hosewright editor benchmark — Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`)
  // the tag must be exported: the build runs in a child process and would otherwise land in .output
  console.log(sh([
    'export HOSEWRIGHT_BUILD_TAG=bench && source scripts/lib/env.sh && source scripts/lib/build.sh',
    'if hw_needs_build; then NODE_OPTIONS=--max-old-space-size=3072 npx nuxt build > "$HW_STATE/build-bench.log" 2>&1 || { tail -n 30 "$HW_STATE/build-bench.log" >&2; exit 1; }; echo "built .output-bench"; else echo ".output-bench is up to date"; fi',
  ].join(' && ')))
  if (!existsSync(resolve(root, '.output-bench/server/index.mjs'))) throw new Error('no .output-bench build')
  sh('bash scripts/db.sh start >/dev/null && bash scripts/db.sh recreate hosewright_bench >/dev/null')
  const databaseUrl = sh('bash scripts/db.sh url hosewright_bench')
  let server: ChildProcess | null = spawn('node', ['.output-bench/server/index.mjs'], {
    cwd: root, stdio: ['ignore', 'ignore', openSync(resolve(sh('source scripts/lib/env.sh && echo "$HW_STATE"'), 'bench-server.log'), 'w')],
    env: { ...process.env, DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: 'bench-session-password-0123456789abcdef', HOSEWRIGHT_TRUST_PROXY: '1', NITRO_HOST: '127.0.0.1', NITRO_PORT: String(port) },
  })
  const browser = await launchBrowser()
  try {
    await waitFor(async () => (await fetch(`${base}/api/health`)).ok, 60_000, 'the server')
    const cookies = new Map<string, string>()
    const api = async <T = any>(method: string, path: string, body?: unknown): Promise<T> => {
      const res = await fetch(base + path, {
        method, body: body === undefined ? undefined : JSON.stringify(body),
        headers: { 'content-type': 'application/json', accept: 'application/json', cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; '), 'x-forwarded-for': '10.9.9.9' },
      })
      for (const c of res.headers.getSetCookie()) {
        const [pair] = c.split(';')
        const eq = pair!.indexOf('=')
        cookies.set(pair!.slice(0, eq).trim(), pair!.slice(eq + 1).trim())
      }
      if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${(await res.text()).slice(0, 300)}`)
      return (await res.json()) as T
    }
    await api('POST', '/api/account', { name: 'Bench Fabricator', email: `bench-${Date.now()}@example.test`, password: 'plenty-long-password-9', workshopName: 'Bench shop' })
    const proj = await api<{ id: string }>('POST', '/api/projects', { title: 'Benchmark build', vehicle: 'test rig', engine: 'test engine', status: 'fabrication' })
    const circuit = await api<{ id: string; version: number }>('POST', `/api/projects/${proj.id}/circuits`, { kind: 'coolant', title: 'Benchmark circuit' })
    // 3 parts and 4 hoses per rung plus the main loop: 332 rungs → 1 002 parts, 1 335 hoses
    const doc = randomCircuit({ seed: 2026, rungs: 332, tidy: true })
    await api('PUT', `/api/circuits/${circuit.id}/graph`, { baseVersion: circuit.version, document: doc })
    const parts = doc.circuit.components.length
    const hoses = doc.circuit.hoses.length

    const context = await newContext(browser, base)
    await context.addCookies([...cookies].map(([name, value]) => ({ name, value, url: base })))
    const page = await context.newPage()
    const scripts = new Map<string, number>()
    page.on('response', async (res) => {
      if (res.request().resourceType() !== 'script' && !res.url().endsWith('.js')) return
      try { scripts.set(res.url(), gzipSync(await res.body()).length) } catch { /* redirects have no body */ }
    })
    const opened = Date.now()
    await page.goto(`/circuits/${circuit.id}`)
    await waitFor(async () => JSON.parse((await page.getByTestId('editor-state').textContent()) || '{}').parts === parts, 60_000, 'the drawing')
    await waitFor(async () => (await page.getByTestId('view-state-side').textContent() || '').includes('viewport'), 30_000, 'the view')
    const openMs = Date.now() - opened
    await page.waitForTimeout(1500)
    const pageJs = [...scripts.values()].reduce((a, b) => a + b, 0)

    const view = JSON.parse((await page.getByTestId('view-state-side').textContent())!)
    const box = (await page.getByTestId('canvas-side').boundingBox())!
    // grab the part whose centre is furthest from any port, bend or hose on the side view, so the
    // press lands on its body (a hose over a part would be bent instead)
    const scene = new ViewScene('side')
    scene.update(doc)
    const clearance = (c: (typeof doc.circuit.components)[number]) => {
      const q = project('side', c.position)
      let d = Infinity
      for (const p of scene.ports.values()) d = Math.min(d, Math.hypot(p.u - q.u, p.v - q.v))
      for (const h of scene.hoses.values()) d = Math.min(d, nearestSegment(h.flat, q).distance)
      return d
    }
    const target = doc.circuit.components.reduce((a, b) => (clearance(b) > clearance(a) ? b : a))
    const q = project('side', target.position)
    const start = { x: box.x + q.u * view.viewport.scale + view.viewport.panX, y: box.y + q.v * view.viewport.scale + view.viewport.panY }

    async function measure(from: { x: number; y: number }, label: string) {
      // page code as text: tsx would otherwise wrap functions in a helper the page does not have
      await page.evaluate(`(() => {
        window.__frames = []
        window.__run = true
        let last = performance.now()
        const tick = (t) => { window.__frames.push(t - last); last = t; if (window.__run) requestAnimationFrame(tick) }
        requestAnimationFrame(tick)
      })()`)
      const before = JSON.parse((await page.getByTestId('view-state-side').textContent())!)
      const drawsBefore = before.drawMs
      const movesBefore = before.moveMs
      const cdp = process.env.BENCH_PROFILE ? await page.context().newCDPSession(page) : null
      if (cdp) { await cdp.send('Profiler.enable'); await cdp.send('Profiler.start') }
      if (process.env.BENCH_TRACE) await browser.startTracing(page, { path: `/tmp/editor-trace-${label.split(' ')[0]}.json`, categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline'] })
      await page.mouse.move(from.x, from.y)
      await page.mouse.down()
      const t0 = Date.now()
      let i = 0
      while (Date.now() - t0 < 2000) {
        i++
        await page.mouse.move(from.x + 120 * Math.sin(i / 15), from.y - 80 * Math.sin(i / 23))
        await new Promise((r) => setTimeout(r, 4))
      }
      await page.mouse.up()
      if (cdp) printProfile((await cdp.send('Profiler.stop')).profile as unknown as CpuProfile)
      if (process.env.BENCH_TRACE) await browser.stopTracing()
      const timeline = (await page.evaluate('(() => { window.__run = false; return window.__frames.slice(1) })()')) as number[]
      let worstAt = 0
      for (let k = 0; k < timeline.length; k++) if (timeline[k]! >= timeline[worstAt]!) worstAt = k
      const worstTime = timeline.slice(0, worstAt + 1).reduce((a, b) => a + b, 0)
      const frames = [...timeline].sort((a, b) => a - b)
      await page.waitForTimeout(300)
      const after = JSON.parse((await page.getByTestId('view-state-side').textContent())!)
      const d = after.drawMs
      const m = after.moveMs
      console.log(`  side view: ${d.staticDraws - drawsBefore.staticDraws} static-layer draws (last ${d.static.toFixed(1)} ms), ${d.liveDraws - drawsBefore.liveDraws} live-layer draws (last ${d.live.toFixed(1)} ms); pointer handling ${((m.total - movesBefore.total) / Math.max(1, m.count - movesBefore.count)).toFixed(2)} ms a move; full re-layouts: ${after.rebuilds.parts - before.rebuilds.parts} of the parts, ${after.rebuilds.hoses - before.rebuilds.hoses} of the hoses`)
      console.log(`${label}: ${frames.length} frames, ${i} pointer moves; frame time median ${percentile(frames, 0.5).toFixed(1)} ms, 95th percentile ${percentile(frames, 0.95).toFixed(1)} ms, worst ${frames.at(-1)!.toFixed(1)} ms (${Math.round(worstTime)} ms into the ${Math.round(timeline.reduce((a, b) => a + b, 0))} ms measured)`)
    }

    console.log(`circuit: ${parts} parts, ${hoses} hoses; editor open with the drawing in ${openMs} ms`)
    await measure(start, `drag one part (${target.label}, side view)`)
    const moved = JSON.parse((await page.getByTestId('editor-state').textContent())!)
    console.log(`  selection after the drag: ${moved.selection.join(', ')} (expected ${target.id})`)
    await page.waitForTimeout(1500) // the analysis after the drag runs in the worker
    await measure({ x: box.x + 30, y: box.y + box.height - 40 }, 'pan the side view (all redrawn)')
    const allJs = [...scripts.values()].reduce((a, b) => a + b, 0)
    const worker = [...scripts].filter(([u]) => u.includes('worker')).reduce((a, [, b]) => a + b, 0)
    console.log(`JavaScript, gzip: editor page ${(pageJs / 1024).toFixed(1)} KB in ${scripts.size - (worker ? 1 : 0)} files; analysis worker ${(worker / 1024).toFixed(1)} KB (loaded on the first change); together ${(allJs / 1024).toFixed(1)} KB`)
    await context.close()
  } finally {
    await browser.close()
    server?.kill('SIGTERM')
    server = null
  }
}

void main().catch((e) => { console.error(e); process.exit(1) })
