import { mkdirSync, writeFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { demoDocument } from '#shared/demo'
import { Client, baseUrl } from '../helpers/http'
import { sql } from '../helpers/db'
import { apiRoutes, fillPath, type ApiRoute } from '../helpers/routes'
import { makeThings, workshopOfFour, type Things, type Workshop } from '../helpers/workshop'

// Every API route (read from server/api, so a new route is fuzzed too) gets fast-check-generated
// parameters, queries and bodies: garbage, hostile text, wrong types, near-valid objects made of the
// field names the schemas use, mutated circuit documents, malformed JSON, multipart forms. Each case
// must be answered without a server error (5xx), and a refused case (4xx) must leave every table as
// it was: the row versions of every table (ctid and xmin change with any insert, update or delete)
// are compared before and after each run of cases. Cases come in windows; when a window holds an
// accepted case (generated input can be valid, and then it may change things), its refused cases are
// sent again on their own and checked then. Figures: test-results/fuzz.json (docs/reliability.md).
const SEED = Number(process.env.HOSEWRIGHT_FUZZ_SEED ?? 20261202)
const MIN_TOTAL = 10_000
const routes = apiRoutes()
  // signing out ends the fuzzing client's session: last, so the others run signed in
  .sort((a, b) => Number(a.key === 'DELETE /api/session') - Number(b.key === 'DELETE /api/session'))
const CASES_PER_ROUTE = Math.ceil(MIN_TOTAL / routes.length)
const WINDOW = 25

// A refused sign-in is counted on purpose (rate limits: server/utils/signInLimit.ts), and the mail
// worker moves outbox rows from pending to sent in the background: those columns are left out.
const SKIPPED_TABLES = new Set(['sign_in_attempts'])
const MAIL_WORKER_COLUMNS = ['status', 'attempts', 'next_attempt_at', 'last_error', 'sent_at']

let w: Workshop
let things: Things
let owner: Client
let tables: string[] = []
const figures = { seed: SEED, routes: routes.length, cases: 0, byStatus: {} as Record<string, number>, accepted: 0, refused: 0, refusedChecked: 0, signedOutCases: 0, ms: 0 }

beforeAll(async () => {
  w = await workshopOfFour('fuzz')
  things = await makeThings(w, 'fuzz')
  owner = w.clients.owner
  tables = (await sql`select tablename from pg_tables where schemaname = 'public' order by tablename`).map(r => r.tablename as string).filter(t => !SKIPPED_TABLES.has(t))
}, 120_000)

afterAll(async () => {
  mkdirSync('test-results', { recursive: true })
  writeFileSync('test-results/fuzz.json', `${JSON.stringify(figures, null, 2)}\n`)
  console.info(`[fuzz] ${JSON.stringify(figures)}`)
  await sql.end()
})

/** Row versions of every table: any write between two calls changes the answer. */
async function fingerprint(): Promise<Record<string, string>> {
  const parts = tables.map(t => t === 'mail_outbox'
    ? `select '${t}' as t, count(*)::int as n, coalesce(md5(string_agg(md5((to_jsonb(x) - ${MAIL_WORKER_COLUMNS.map(c => `'${c}'`).join(' - ')})::text), ',' order by x.id)), '') as h from "${t}" x`
    : `select '${t}' as t, count(*)::int as n, coalesce(md5(string_agg(ctid::text || xmin::text, ',' order by ctid)), '') as h from "${t}"`)
  const rows = await sql.unsafe(parts.join(' union all '))
  return Object.fromEntries(rows.map(r => [r.t, `${r.n}:${r.h}`]))
}

function changedTables(before: Record<string, string>, after: Record<string, string>) {
  return Object.keys(after).filter(t => before[t] !== after[t])
}

// ── what is generated
const hostile = fc.constantFrom(
  `x'); drop table users; --`, `" or 1=1 --`, '<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '../../etc/passwd',
  '..\\..\\boot.ini', '%2e%2e%2f', '%00', '\u0000', 'null', 'undefined', 'NaN', 'Infinity', '-1', '0', '1e309', '9007199254740993',
  ' ', '', '\u202e', '𝕳𝖔𝖘𝖊', '__proto__', 'constructor', '{"$ne":null}', '${7*7}', 'a'.repeat(5000), 'someone@example.test',
)
const words = fc.constantFrom('owner', 'fabricator', 'reviewer', 'technician', 'coolant', 'fuel', 'component', 'hose', 'L', 'bar', 'psi', 'kPa',
  'US gal', 'a4', 'letter', 'in-review', 'approved', 'active', 'archived', 'all', 'asc', 'desc', 'title', 'updatedAt', 'caution/hot-cap', 'engine', 'radiator')
const FIELDS = ['title', 'name', 'email', 'password', 'currentPassword', 'workshopName', 'vehicle', 'engine', 'notes', 'status', 'dueDate', 'kind',
  'role', 'body', 'version', 'baseVersion', 'document', 'note', 'findingKey', 'justification', 'anchor', 'parentId', 'elementId', 'confirmTitle',
  'fabricatorMayApproveOwn', 'preferences', 'lineId', 'bought', 'fitted', 'description', 'quantity', 'unit', 'stepId', 'done', 'startPressure',
  'endPressure', 'minutesHeld', 'passed', 'volume', 'temperature', 'componentId', 'type', 'params', 'ports', 'id', '__proto__']
const QUERY_KEYS = ['q', 'status', 'sort', 'dir', 'page', 'pageSize', 'state', 'from', 'to', 'paper', 'lineId', 'componentId', 'kind', 'before', 'limit']

function realIds(): string[] {
  return [things.projectId, things.circuitId, things.openCircuitId, things.reviewId, things.openReviewId, things.commentId, things.templateId,
    things.photoId, things.invitationId, things.outboxId, things.ackId, w.workshopId, w.membershipIds.technician]
}

const scalar = () => fc.oneof(
  { weight: 3, arbitrary: fc.string({ maxLength: 40 }) }, fc.integer(), fc.double(), fc.boolean(), fc.constant(null),
  { weight: 2, arbitrary: hostile }, { weight: 2, arbitrary: words }, fc.uuid(), fc.constantFrom(...realIds()),
)
const value = () => fc.oneof(
  { weight: 5, arbitrary: scalar() }, fc.array(scalar(), { maxLength: 4 }),
  fc.dictionary(fc.constantFrom(...FIELDS), scalar(), { maxKeys: 3 }), fc.jsonValue({ maxDepth: 2 }),
)
/** Objects made of the field names the routes read, with values of any kind. */
const shaped = () => fc.dictionary(fc.constantFrom(...FIELDS), value(), { maxKeys: 6 })

/** The demo document with one value somewhere replaced, removed or of the wrong kind. */
function mutatedDocument() {
  const paths: Array<Array<string | number>> = []
  const walk = (node: unknown, path: Array<string | number>) => {
    paths.push(path)
    if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) walk(v, [...path, Array.isArray(node) ? Number(k) : k])
  }
  walk(demoDocument(), [])
  return fc.tuple(fc.nat(paths.length - 1), fc.option(value(), { nil: undefined }), fc.nat(3)).map(([at, replacement, extra]) => {
    const doc = demoDocument() as unknown as Record<string | number, any>
    const path = paths[at]!
    if (path.length === 0) return replacement
    let node = doc
    for (const k of path.slice(0, -1)) node = node[k]
    const last = path.at(-1)!
    if (replacement === undefined) delete node[last]
    else node[last] = replacement
    // sometimes two changes: one more part with the same id (duplicates), or a huge list
    if (extra === 1) doc.circuit?.components?.push?.(doc.circuit.components[0])
    if (extra === 2 && Array.isArray(doc.circuit?.hoses)) doc.circuit.hoses = Array.from({ length: 300 }, () => doc.circuit.hoses[0])
    return doc
  })
}

type Body = { kind: 'json'; value: unknown } | { kind: 'raw'; text: string; type: string } | { kind: 'form'; fields: Array<[string, string]>; file?: { bytes: Uint8Array; name: string; type: string } }

function bodyFor(route: ApiRoute): fc.Arbitrary<Body | undefined> {
  const json = (a: fc.Arbitrary<unknown>) => a.map(v => ({ kind: 'json', value: v }) as Body)
  const raw = fc.tuple(fc.oneof(fc.constantFrom('{', '[', '{"title":', 'nul', '"', '{"a":1}}', '\u0000', '{"body":"\\u0000"}', '[[[[[[[[[[[[[[[[[[[[[[[[]]]]]]]]]]]]]]]]]]]]]]]'), fc.string({ maxLength: 60 })),
    fc.constantFrom('application/json', 'application/json', 'text/plain', 'application/x-www-form-urlencoded', 'application/merge-patch+json'))
    .map(([text, type]) => ({ kind: 'raw', text, type }) as Body)
  const form = fc.record({
    fields: fc.array(fc.tuple(fc.constantFrom('componentId', 'file', 'label', 'x'), fc.oneof(fc.string({ maxLength: 20 }), hostile, words)), { maxLength: 3 }),
    file: fc.option(fc.record({
      // random bytes, half of them behind a PNG signature
      bytes: fc.tuple(fc.boolean(), fc.uint8Array({ maxLength: 300 })).map(([png, b]) => png ? new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...b]) : b),
      name: fc.oneof(fc.string({ maxLength: 20 }), hostile, fc.constantFrom('../../x.png', 'a.png', 'x.svg', '.htaccess')),
      type: fc.constantFrom('image/png', 'image/jpeg', 'image/svg+xml', 'text/html', 'application/octet-stream'),
    }), { nil: undefined }),
  }).map(f => ({ kind: 'form', ...f }) as Body)
  const isDocumentRoute = /graph$|analyze$|import$/.test(route.key)
  const documentBody = mutatedDocument().chain(doc => route.key.endsWith('analyze')
    ? fc.constant(doc)
    : fc.record({ baseVersion: fc.oneof(fc.constant(things.version), fc.integer()), document: fc.constant(doc), title: fc.option(scalar(), { nil: undefined }) }))
  const options: Array<{ weight: number; arbitrary: fc.Arbitrary<Body | undefined> }> = [
    { weight: 6, arbitrary: json(shaped()) }, { weight: 2, arbitrary: json(fc.jsonValue({ maxDepth: 3 })) }, { weight: 1, arbitrary: raw },
  ]
  if (isDocumentRoute) options.push({ weight: 8, arbitrary: json(documentBody) })
  if (route.key.endsWith('/photos') && route.method === 'POST') options.push({ weight: 8, arbitrary: form })
  // fetch sends no body with GET
  if (route.method === 'GET') return fc.constant(undefined)
  if (route.method === 'DELETE') options.push({ weight: 4, arbitrary: fc.constant(undefined) })
  return fc.oneof(...options)
}

function realParam(route: ApiRoute, name: string): string | undefined {
  if (name === 'photoId') return things.photoId
  if (name === 'ackId') return things.ackId
  if (name === 'version') return String(things.version)
  if (name === 'token') return undefined
  const resource = route.segments[route.segments.indexOf(`:${name}`) - 1]
  return ({
    projects: things.projectId, circuits: things.circuitId, comments: things.commentId, invitations: things.invitationId,
    members: w.membershipIds.technician, outbox: things.outboxId, reviews: route.key.includes('acknowledgements') ? things.openReviewId : things.reviewId,
    templates: things.templateId, workshops: w.workshopId,
  } as Record<string, string>)[resource ?? '']
}

const token = fc.string({ unit: fc.constantFrom(...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-_'), minLength: 43, maxLength: 43 })

function caseFor(route: ApiRoute) {
  const params = fc.record(Object.fromEntries(route.params.map((name) => {
    const real = realParam(route, name)
    const own = real ? fc.constant(real) : name === 'token' ? token : fc.uuid()
    return [name, fc.oneof({ weight: 5, arbitrary: own }, fc.uuid(), fc.string({ maxLength: 40 }), hostile, fc.integer().map(String))]
  })))
  const query = fc.option(fc.dictionary(fc.oneof(fc.constantFrom(...QUERY_KEYS), fc.string({ maxLength: 8 })),
    fc.oneof(fc.string({ maxLength: 20 }), hostile, words, fc.integer().map(String)), { maxKeys: 4 }), { nil: undefined, freq: 3 })
  return fc.record({ params, query, body: bodyFor(route), signedOut: fc.nat(19).map(n => n === 0) })
}

interface Case { params: Record<string, string>; query?: Record<string, string>; body?: Body; signedOut: boolean }

async function send(route: ApiRoute, c: Case): Promise<{ status: number; text: string }> {
  const qs = c.query ? new URLSearchParams(c.query).toString() : ''
  const path = fillPath(route, c.params) + (qs ? `?${qs}` : '')
  const headers: Record<string, string> = { accept: 'application/json', 'x-forwarded-for': '10.77.0.1' }
  const client = c.signedOut ? undefined : owner
  if (client?.cookies.size) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  let body: BodyInit | undefined
  if (c.body?.kind === 'json') {
    headers['content-type'] = 'application/json'
    body = JSON.stringify(c.body.value) ?? 'null'
  } else if (c.body?.kind === 'raw') {
    headers['content-type'] = c.body.type
    body = c.body.text
  } else if (c.body?.kind === 'form') {
    const form = new FormData()
    for (const [k, v] of c.body.fields) form.append(k, v)
    if (c.body.file) form.append('file', new Blob([new Uint8Array(c.body.file.bytes)], { type: c.body.file.type }), c.body.file.name)
    body = form
  }
  const res = await fetch(baseUrl + path, { method: route.method, headers, body, redirect: 'manual' })
  const text = await res.text()
  return { status: res.status, text }
}

describe('the table check', () => {
  it('notices an accepted write (so an unchanged answer means nothing was written)', async () => {
    const before = await fingerprint()
    expect(changedTables(before, await fingerprint())).toEqual([])
    expect((await owner.patch(`/api/projects/${things.projectId}`, { notes: 'Checked before fuzzing' })).status).toBe(200)
    expect(changedTables(before, await fingerprint())).toContain('projects')
  })
})

describe(`fuzzing every API route (${routes.length} routes × ${CASES_PER_ROUTE} cases, seed ${SEED})`, () => {
  routes.forEach((route, index) => {
    it(route.key, async () => {
      const started = Date.now()
      const cases = fc.sample(caseFor(route), { numRuns: CASES_PER_ROUTE, seed: SEED + index }) as Case[]
      const serverErrors: string[] = []
      const changed: string[] = []
      for (let at = 0; at < cases.length; at += WINDOW) {
        const window = cases.slice(at, at + WINDOW)
        const before = await fingerprint()
        const answers: Array<{ status: number; text: string }> = []
        for (const c of window) {
          const answer = await send(route, c)
          answers.push(answer)
          figures.byStatus[answer.status] = (figures.byStatus[answer.status] ?? 0) + 1
          if (c.signedOut) figures.signedOutCases++
          if (answer.status >= 500) serverErrors.push(`${answer.status} for ${JSON.stringify(c).slice(0, 600)}: ${answer.text.slice(0, 300)}`)
        }
        const refused = window.filter((_, i) => answers[i]!.status >= 400 && answers[i]!.status < 500)
        const accepted = window.length - refused.length
        figures.cases += window.length
        figures.accepted += answers.filter(a => a.status < 400).length
        figures.refused += refused.length
        if (accepted === 0) {
          const diff = changedTables(before, await fingerprint())
          if (diff.length) changed.push(`${diff.join(', ')} after refused cases ${at}–${at + window.length - 1}`)
          else figures.refusedChecked += refused.length
          continue
        }
        // an accepted case may change things: its window's refused cases go again, on their own
        for (const c of refused) {
          const again = await fingerprint()
          const answer = await send(route, c)
          if (answer.status < 400) continue // valid now that something else changed: not a refused case any more
          if (answer.status >= 500) serverErrors.push(`${answer.status} on replay for ${JSON.stringify(c).slice(0, 600)}`)
          const diff = changedTables(again, await fingerprint())
          if (diff.length) changed.push(`${diff.join(', ')} after refused ${JSON.stringify(c).slice(0, 400)} (${answer.status})`)
          else figures.refusedChecked++
        }
      }
      figures.ms += Date.now() - started
      expect(serverErrors, 'server errors').toEqual([])
      expect(changed, 'tables changed by refused input').toEqual([])
    }, 120_000)
  })

  it(`sent at least ${MIN_TOTAL} cases, and checked the tables after every refused one`, () => {
    expect(figures.cases).toBeGreaterThanOrEqual(MIN_TOTAL)
    // a refused case is unchecked only when its replay was accepted (something it needed had changed)
    expect(figures.refusedChecked).toBeGreaterThan(figures.refused * 0.95)
    // most generated input is refused; a fuzzer whose every case passed would test nothing
    expect(figures.refused).toBeGreaterThan(figures.cases / 2)
  })
})
