// API benchmark: npm run bench:api
// Builds the app when sources changed (HOSEWRIGHT_BUILD_TAG, default "bench", as bench:editor), starts
// it on loopback with a database of its own (demo seeded, plus a bench workshop: 30 projects and
// circuits of about 500 parts), and loads it with autocannon: list projects, load a circuit, save it,
// analyse it, with a static file and the signed-in session check as baselines. In the same run,
// postgres.js reads the same rows the load route reads (the circuit, its parts, ports and hoses)
// straight from PostgreSQL, at the same concurrency. Prints requests/s, p50 and p99 and the ratios.
// Asserts nothing; the figures go into docs/performance.md ("API").
//   BENCH_SECONDS (8) per scenario · BENCH_CONNECTIONS ("1,8") concurrency levels · HOSEWRIGHT_BENCH_PORT (3191)
import { execFileSync, spawn, type ChildProcess } from 'node:child_process'
import { existsSync, openSync } from 'node:fs'
import { cpus, loadavg } from 'node:os'
import { resolve } from 'node:path'
import autocannon from 'autocannon'
import postgres from 'postgres'
import { randomCircuit } from '../shared/demo'

const root = resolve(import.meta.dirname, '..')
const tag = process.env.HOSEWRIGHT_BUILD_TAG || 'bench'
const output = `.output-${tag}`
const port = Number(process.env.HOSEWRIGHT_BENCH_PORT ?? 3191)
const base = `http://127.0.0.1:${port}`
const seconds = Number(process.env.BENCH_SECONDS ?? 8)
const levels = (process.env.BENCH_CONNECTIONS ?? '1,8').split(',').map(Number).filter(n => n > 0)
const database = 'hosewright_bench_api'
const sh = (script: string) => execFileSync('bash', ['-c', script], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] }).trim()

interface Figures { name: string; connections: number; rps: number; p50: number; p99: number; requests: number; failures: number }

async function waitFor(check: () => Promise<boolean>, ms: number, what: string) {
  const end = Date.now() + ms
  while (Date.now() < end) {
    if (await check().catch(() => false)) return
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`timed out waiting for ${what}`)
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((sorted.length - 1) * p))] ?? NaN
}

/** One autocannon run; answers other than the expected status count as failures. */
async function cannon(name: string, connections: number, options: Partial<autocannon.Options> & { path?: string }, expectStatus = 200): Promise<Figures> {
  let failures = 0
  const { path = '/', setupClient, ...rest } = options as Partial<autocannon.Options> & { path?: string }
  const result = await autocannon({
    url: base + path, connections, duration: seconds, pipelining: 1, ...rest,
    setupClient: (client) => {
      setupClient?.(client)
      client.on('response', (statusCode: number) => { if (statusCode !== expectStatus) failures++ })
    },
  } as autocannon.Options)
  return {
    name, connections, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99,
    requests: result.requests.total, failures: failures + result.errors + result.timeouts,
  }
}

/** The load route's reads, straight from PostgreSQL: the circuit row, then parts, ports and hoses. */
async function rawSelect(sql: postgres.Sql, connections: number, circuitId: string, workshopId: string): Promise<Figures> {
  const latencies: number[] = []
  const end = Date.now() + seconds * 1000
  const once = async () => {
    const [c] = await sql`select * from circuits where id = ${circuitId} and workshop_id = ${workshopId}`
    await Promise.all([
      sql`select * from circuit_components where circuit_id = ${c!.id} and workshop_id = ${workshopId} order by position`,
      sql`select * from circuit_ports where circuit_id = ${c!.id} and workshop_id = ${workshopId} order by position`,
      sql`select * from circuit_hoses where circuit_id = ${c!.id} and workshop_id = ${workshopId} order by position`,
    ])
  }
  for (let i = 0; i < 50; i++) await once() // warm-up: prepared statements, caches
  const started = Date.now()
  await Promise.all(Array.from({ length: connections }, async () => {
    while (Date.now() < end) {
      const t = process.hrtime.bigint()
      await once()
      latencies.push(Number(process.hrtime.bigint() - t) / 1e6)
    }
  }))
  const elapsed = (Date.now() - started) / 1000
  latencies.sort((a, b) => a - b)
  return { name: 'raw SQL select (postgres.js)', connections, rps: latencies.length / elapsed, p50: percentile(latencies, 0.5), p99: percentile(latencies, 0.99), requests: latencies.length, failures: 0 }
}

async function main() {
  console.log(`Hosewright API benchmark — Node ${process.version}, ${cpus().length} × ${cpus()[0]?.model ?? 'CPU'}, ${new Date().toISOString().slice(0, 10)}`)
  console.log(sh([
    `export HOSEWRIGHT_BUILD_TAG=${tag} && source scripts/lib/env.sh && source scripts/lib/build.sh`,
    `if hw_needs_build; then NODE_OPTIONS=--max-old-space-size=3072 npx nuxt build > "$HW_STATE/build-${tag}.log" 2>&1 || { tail -n 30 "$HW_STATE/build-${tag}.log" >&2; exit 1; }; echo "built ${output}"; else echo "${output} is up to date"; fi`,
  ].join(' && ')))
  if (!existsSync(resolve(root, output, 'server/index.mjs'))) throw new Error(`no ${output} build`)
  sh(`bash scripts/db.sh start >/dev/null && bash scripts/db.sh recreate ${database} >/dev/null`)
  const databaseUrl = sh(`bash scripts/db.sh url ${database}`)
  const logFile = resolve(sh('source scripts/lib/env.sh && echo "$HW_STATE"'), 'bench-api-server.log')
  const log = openSync(logFile, 'w')
  let server: ChildProcess | null = spawn('node', [`${output}/server/index.mjs`], {
    cwd: root, stdio: ['ignore', log, log],
    env: {
      PATH: process.env.PATH, HOME: process.env.HOME, NODE_ENV: 'production', DATABASE_URL: databaseUrl,
      NUXT_SESSION_PASSWORD: 'bench-session-password-0123456789abcdef', HOSEWRIGHT_SEED_DEMO: '1',
      HOSEWRIGHT_MAIL_WORKER: '0', NITRO_HOST: '127.0.0.1', NITRO_PORT: String(port),
    },
  })
  const sql = postgres(databaseUrl, { max: Math.max(...levels), onnotice: () => {} })
  try {
    await waitFor(async () => (await fetch(`${base}/api/health`)).ok, 90_000, 'the server')
    let cookie = ''
    const api = async <T = any>(method: string, path: string, body?: unknown): Promise<T> => {
      const res = await fetch(base + path, {
        method, body: body === undefined ? undefined : JSON.stringify(body),
        headers: { 'content-type': 'application/json', accept: 'application/json', ...(cookie ? { cookie } : {}) },
      })
      const set = res.headers.getSetCookie()[0]
      if (set) cookie = set.split(';')[0]!
      if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${(await res.text()).slice(0, 300)}`)
      return (await res.json()) as T
    }
    const signedUp = await api<{ workshop: { id: string } }>('POST', '/api/account', { name: 'Bench Owner', email: `bench-api-${Date.now()}@example.test`, password: 'plenty-long-password-9', workshopName: 'Bench shop' })
    const workshopId = signedUp.workshop.id
    const projects: string[] = []
    for (let i = 0; i < 30; i++) projects.push((await api<{ id: string }>('POST', '/api/projects', { title: `Bench build ${i + 1}`, vehicle: 'test rig', engine: 'test engine' })).id)
    // 3 parts per rung plus the main loop: 165 rungs → about 500 parts
    const doc = randomCircuit({ seed: 2026, rungs: 165, tidy: true })
    const docJson = JSON.stringify(doc)
    // one circuit to read and analyse, and one per connection to save (saves from one base would conflict)
    const circuits: Array<{ id: string; version: number }> = []
    for (let i = 0; i <= Math.max(...levels); i++) {
      const c = await api<{ id: string; version: number }>('POST', `/api/projects/${projects[i % projects.length]}/circuits`, { kind: 'coolant', title: `Bench circuit ${i}` })
      const saved = await api<{ version: number }>('PUT', `/api/circuits/${c.id}/graph`, { baseVersion: c.version, document: doc })
      circuits.push({ id: c.id, version: saved.version })
    }
    const loaded = circuits[0]!
    const graph = await api<{ document: { circuit: { components: Array<{ ports: unknown[] }>; hoses: unknown[] } } }>('GET', `/api/circuits/${loaded.id}/graph`)
    const parts = graph.document.circuit.components.length
    const ports = graph.document.circuit.components.reduce((n, c) => n + c.ports.length, 0)
    const loadBytes = JSON.stringify(graph).length
    console.log(`circuit: ${parts} parts, ${ports} ports, ${graph.document.circuit.hoses.length} hoses; load answer ${(loadBytes / 1024).toFixed(0)} KB, save body ${(docJson.length / 1024).toFixed(0)} KB`)
    console.log(`${seconds} s per scenario at ${levels.join(' and ')} connection(s); load average before: ${loadavg().map(n => n.toFixed(1)).join(' ')}\n`)

    const headers = { cookie, accept: 'application/json' }
    const json = { ...headers, 'content-type': 'application/json' }
    const rows: Figures[] = []
    for (const connections of levels) {
      const run = async (f: Promise<Figures>) => {
        const r = await f
        rows.push(r)
        console.log(`  ${r.name.padEnd(34)} c=${String(r.connections).padEnd(3)} ${r.rps.toFixed(0).padStart(6)} req/s  p50 ${r.p50.toFixed(1).padStart(6)} ms  p99 ${r.p99.toFixed(1).padStart(6)} ms  (${r.requests} requests${r.failures ? `, ${r.failures} FAILED` : ''})`)
      }
      await run(cannon('static file (/favicon.svg)', connections, { path: '/favicon.svg' }))
      await run(cannon('session check (GET /api/session)', connections, { path: '/api/session', headers }))
      await run(cannon('list projects (GET /api/projects)', connections, { path: '/api/projects', headers }))
      await run(rawSelect(sql, connections, loaded.id, workshopId))
      await run(cannon('load circuit (GET …/graph)', connections, { path: `/api/circuits/${loaded.id}/graph`, headers }))
      await run(cannon('analyse (POST /api/analyze)', connections, { path: '/api/analyze', method: 'POST', headers: json, body: docJson }))
      // the report of every load above came from memory (server/utils/reportCache.ts keeps 8); here
      // 9 circuits are loaded in turn, so none is in memory when it comes up again
      let first = 0
      await run(cannon('load, report not cached', connections, {
        setupClient: (client: any) => {
          const offset = first++
          client.setRequests(circuits.map((_, i) => ({ method: 'GET', path: `/api/circuits/${circuits[(i + offset) % circuits.length]!.id}/graph`, headers })))
        },
      }))
      // each connection saves its own circuit and follows its version (autocannon resets a
      // request's context every round, so the version lives on the circuit, per connection)
      let next = 1
      await run(cannon('save circuit (PUT …/graph)', connections, {
        setupClient: (client: any) => {
          const mine = circuits[next++]!
          client.setRequests([{
            method: 'PUT', path: `/api/circuits/${mine.id}/graph`, headers: json,
            setupRequest: (req: any) => ({ ...req, body: `{"baseVersion":${mine.version},"document":${docJson}}` }),
            onResponse: (status: number, body: string) => {
              if (status === 200) mine.version = JSON.parse(body).version
              else if (status === 409) mine.version = JSON.parse(body).data.currentVersion
            },
          }])
        },
      }))
      console.log()
    }

    console.log('Ratios (p50 against p50 at the same concurrency):')
    for (const connections of levels) {
      const at = (name: string) => rows.find(r => r.connections === connections && r.name.startsWith(name))!
      const raw = at('raw SQL')
      const load = at('load circuit')
      const cold = at('load, report not cached')
      const session = at('session check')
      const ratio = load.p50 / raw.p50
      console.log(`  c=${connections}: load / raw select ${ratio.toFixed(2)} (target ≤ 3: ${ratio <= 3 ? 'met' : 'NOT met'}); not cached / raw select ${(cold.p50 / raw.p50).toFixed(2)}; load / session check ${(load.p50 / session.p50).toFixed(1)}; ` +
        `list / session check ${(at('list projects').p50 / session.p50).toFixed(1)}; session check / static ${(session.p50 / at('static').p50).toFixed(1)}`)
    }
    console.log(`\nload average after: ${loadavg().map(n => n.toFixed(1)).join(' ')}; server log: ${logFile}`)
  } finally {
    await new Promise(r => setTimeout(r, 1000)) // requests autocannon left running at the end
    await sql.end()
    server?.kill('SIGTERM')
    server = null
  }
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
