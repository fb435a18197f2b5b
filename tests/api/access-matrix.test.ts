import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { templateFromComponent } from '#shared/schemas/template'
import { Client, addMember, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { sql } from '../helpers/db'
import { linkFrom, mailTo, tokenOf, waitForMail } from '../helpers/mail'
import { apiRoutes } from '../helpers/routes'
import { AIR_TRAP, ROLES, uploadPhoto, warningOnlyDocument, workshopOfFour, type Role, type Workshop } from '../helpers/workshop'

// Who may call each API route: the four roles of the workshop that owns the rows, the same four roles
// in another workshop, and nobody signed in. The expected answers are written out below, one line per
// route; the routes come from the files under server/api, so a route without a line fails the suite.
// Another workshop's rows answer 404, exactly as rows that do not exist; the role is checked before
// any row is looked up, so a role that may not do this at all gets 403 whatever the row. Every case gets fresh rows
// (prepare), so no case depends on what another did.
afterAll(() => sql.end())

type Who = Role | `other ${Role}` | 'signed out'
const WHO: Who[] = [...ROLES, ...ROLES.map(r => `other ${r}` as const), 'signed out']

interface Case { method?: string; path: string; body?: unknown; upload?: boolean; as?: Client; after?: () => Promise<void> }
interface Row { expect: string; prepare: (who: Who, client: Client) => Promise<Case> }

let a: Workshop
let b: Workshop
const clientOf = (who: Who): Client => who === 'signed out' ? new Client() : who.startsWith('other ') ? b.clients[who.slice(6) as Role] : a.clients[who as Role]
const emailOf = (who: Who): string => who.startsWith('other ') ? b.emails[who.slice(6) as Role] : a.emails[who as Role]
/** The same person in a second session, for cases that end or replace the session. */
async function secondSession(who: Who): Promise<Client> {
  if (who === 'signed out') return new Client()
  const c = new Client('10.88.0.1')
  expect((await c.post('/api/session', { email: emailOf(who), password: goodPassword })).status).toBe(200)
  return c
}

beforeAll(async () => {
  ;[a, b] = await Promise.all([workshopOfFour('matrix'), workshopOfFour('matrixother')])
}, 120_000)

// ── fresh rows in workshop A, made by the roles that make them
let n = 0
// password resets are limited per address: each case comes from an address of its own
const freshAddress = () => `10.89.${Math.floor(++n / 250) % 250}.${n % 250}`
async function project() {
  return (await a.clients.fabricator.post('/api/projects', { title: `Matrix build ${++n}` })).body.id as string
}
async function circuit(doc: CircuitDocument | null = correctedDemoDocument(), { submit = false, approve = false } = {}) {
  const fab = a.clients.fabricator
  const projectId = await project()
  const title = `Matrix circuit ${++n}`
  const id = (await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title })).body.id as string
  if (!doc) return { id, projectId, title, version: 1, reviewId: '' }
  doc.circuit.title = title
  const version = (await fab.put(`/api/circuits/${id}/graph`, { baseVersion: 1, document: doc })).body.version as number
  let reviewId = ''
  if (submit || approve) reviewId = (await fab.post(`/api/circuits/${id}/reviews`, { version, note: '' })).body.id
  if (approve) expect((await a.clients.reviewer.post(`/api/reviews/${reviewId}/approve`, {})).status).toBe(200)
  return { id, projectId, title, version, reviewId }
}
const shopOf = async () => {
  const c = await circuit(correctedDemoDocument(), { approve: true })
  return `/api/circuits/${c.id}/versions/${c.version}/shop`
}
async function comment(by: Client = a.clients.fabricator) {
  const c = await circuit()
  return (await by.post(`/api/circuits/${c.id}/comments`, { body: 'Check this clamp', version: c.version, anchor: { kind: 'component', elementId: 'engine' } })).body.id as string
}
async function template() {
  const body = templateFromComponent(demoDocument().circuit.components.find(c => c.id === 'thermostat')!)
  return (await a.clients.fabricator.post('/api/templates', { name: `Matrix thermostat ${++n}`, body })).body.id as string
}
async function invitation() {
  const email = uniqueEmail('matrixinvite')
  const res = await a.clients.owner.post('/api/members', { email, role: 'technician', name: 'Matrix invitee' })
  return { id: res.body.id as string, email }
}
async function inviteToken() {
  const { email } = await invitation()
  return tokenOf(linkFrom(await waitForMail(email, { subject: 'Join ', timeoutMs: 30_000 }), '/invite/'))
}
async function resetToken() {
  const { email } = await signUp('matrixreset')
  const after = (await mailTo(email)).length
  expect((await new Client(freshAddress()).post('/api/password-resets', { email })).status).toBe(202)
  return tokenOf(linkFrom(await waitForMail(email, { after, timeoutMs: 30_000 }), '/reset-password/'))
}
const withWarning = async () => {
  const c = await circuit(warningOnlyDocument(), { submit: true })
  return c.reviewId
}

// Expected answers: owner fabricator reviewer technician | the same in another workshop | signed out
const read = '200 200 200 200 | 404 404 404 404 | 401'
const write = (ok: number) => `${ok} ${ok} 403 403 | 404 404 403 403 | 401`
const ownerOnly = (ok: number) => `${ok} 403 403 403 | 404 403 403 403 | 401`
// review decisions look the review up first (review:read), then check who may decide
const decide = (ok: number) => `${ok} 403 ${ok} 403 | 404 404 404 404 | 401`
const record = (ok: number) => `${ok} ${ok} 403 ${ok} | 404 404 403 404 | 401`
const anyone = (ok: number) => `${ok} ${ok} ${ok} ${ok} | ${ok} ${ok} ${ok} ${ok} | ${ok}`
const signedIn = (ok: number) => `${ok} ${ok} ${ok} ${ok} | ${ok} ${ok} ${ok} ${ok} | 401`
/** Routes on the caller's own workshop (no row id in the path): another workshop's members get their own. */
const ownWorkshop = (own: string) => `${own} | ${own} | 401`

const rows: Record<string, Row> = {
  // ── account and session
  'POST /api/account': {
    expect: anyone(201),
    prepare: async () => ({ path: '/api/account', body: { name: 'Matrix newcomer', email: uniqueEmail('matrixnew'), password: goodPassword, workshopName: 'Matrix new shop' } }),
  },
  'PATCH /api/account': { expect: signedIn(200), prepare: async () => ({ path: '/api/account', body: { preferences: { units: 'metric' } } }) },
  'POST /api/account/password': {
    expect: signedIn(200),
    prepare: async (who, client) => ({
      path: '/api/account/password', body: { currentPassword: goodPassword, newPassword: `${goodPassword}-new` },
      // put the old password back, so later cases can sign in with it
      after: async () => { if (who !== 'signed out') await client.post('/api/account/password', { currentPassword: `${goodPassword}-new`, newPassword: goodPassword }) },
    }),
  },
  'GET /api/session': { expect: anyone(200), prepare: async () => ({ path: '/api/session' }) },
  'POST /api/session': {
    expect: anyone(200),
    prepare: async () => ({ path: '/api/session', body: { email: (await signUp('matrixsignin')).email, password: goodPassword }, as: new Client('10.88.0.3') }),
  },
  'DELETE /api/session': { expect: anyone(200), prepare: async who => ({ path: '/api/session', as: await secondSession(who) }) },
  'GET /api/workshops': { expect: signedIn(200), prepare: async () => ({ path: '/api/workshops' }) },
  'POST /api/workshops/:id/switch': { expect: '200 200 200 200 | 404 404 404 404 | 401', prepare: async who => ({ path: `/api/workshops/${a.workshopId}/switch`, as: await secondSession(who) }) },
  'GET /api/workshops/:id/settings': { expect: read, prepare: async () => ({ path: `/api/workshops/${a.workshopId}/settings` }) },
  'PATCH /api/workshops/:id/settings': { expect: ownerOnly(200), prepare: async () => ({ path: `/api/workshops/${a.workshopId}/settings`, body: { fabricatorMayApproveOwn: false } }) },
  'GET /api/health': { expect: anyone(200), prepare: async () => ({ path: '/api/health' }) },
  'POST /api/analyze': { expect: signedIn(200), prepare: async () => ({ path: '/api/analyze', body: demoDocument() }) },

  // ── members, invitations, mail
  'GET /api/members': { expect: ownWorkshop('200 403 403 403'), prepare: async () => ({ path: '/api/members' }) },
  'POST /api/members': { expect: ownWorkshop('201 403 403 403'), prepare: async () => ({ path: '/api/members', body: { email: uniqueEmail('matrixadd'), role: 'technician' } }) },
  'PATCH /api/members/:id': { expect: ownerOnly(200), prepare: async () => ({ path: `/api/members/${(await addMember(a.clients.owner, 'technician', 'matrixpatch')).membershipId}`, body: { role: 'reviewer' } }) },
  'DELETE /api/members/:id': { expect: ownerOnly(200), prepare: async () => ({ path: `/api/members/${(await addMember(a.clients.owner, 'technician', 'matrixgone')).membershipId}` }) },
  'GET /api/invitations': { expect: ownWorkshop('200 403 403 403'), prepare: async () => ({ path: '/api/invitations' }) },
  'DELETE /api/invitations/:id': { expect: ownerOnly(200), prepare: async () => ({ path: `/api/invitations/${(await invitation()).id}` }) },
  'POST /api/invitations/:id/resend': { expect: ownerOnly(200), prepare: async () => ({ path: `/api/invitations/${(await invitation()).id}/resend` }) },
  'GET /api/invitations/token/:token': { expect: anyone(200), prepare: async () => ({ path: `/api/invitations/token/${await inviteToken()}` }) },
  'POST /api/invitations/token/:token/accept': {
    expect: anyone(200),
    prepare: async () => ({ path: `/api/invitations/token/${await inviteToken()}/accept`, body: { name: 'Matrix joiner', password: goodPassword }, as: new Client('10.88.0.4') }),
  },
  'GET /api/outbox': { expect: ownWorkshop('200 403 403 403'), prepare: async () => ({ path: '/api/outbox' }) },
  'POST /api/outbox/:id/retry': {
    expect: ownerOnly(200),
    prepare: async () => {
      const { id } = await invitation()
      // a mail that gave up: the one state "send again" is for
      const [row] = await sql`update mail_outbox set status = 'failed' where id = (select mail_id from invitations where id = ${id}) returning id`
      return { path: `/api/outbox/${row!.id}/retry` }
    },
  },
  'POST /api/password-resets': { expect: anyone(202), prepare: async () => ({ path: '/api/password-resets', body: { email: uniqueEmail('matrixnobody') }, as: new Client(freshAddress()) }) },
  'GET /api/password-resets/:token': { expect: anyone(200), prepare: async () => ({ path: `/api/password-resets/${await resetToken()}` }) },
  'POST /api/password-resets/:token/complete': {
    expect: anyone(200),
    prepare: async () => ({ path: `/api/password-resets/${await resetToken()}/complete`, body: { password: `${goodPassword}-reset` }, as: new Client(freshAddress()) }),
  },

  // ── projects
  'GET /api/projects': { expect: ownWorkshop('200 200 200 200'), prepare: async () => ({ path: '/api/projects' }) },
  'POST /api/projects': { expect: ownWorkshop('201 201 403 403'), prepare: async () => ({ path: '/api/projects', body: { title: 'Matrix new build' } }) },
  'GET /api/projects/:id': { expect: read, prepare: async () => ({ path: `/api/projects/${await project()}` }) },
  'PATCH /api/projects/:id': { expect: write(200), prepare: async () => ({ path: `/api/projects/${await project()}`, body: { notes: 'Changed' } }) },
  'POST /api/projects/:id/archive': { expect: write(200), prepare: async () => ({ path: `/api/projects/${await project()}/archive` }) },
  'POST /api/projects/:id/restore': {
    expect: write(200),
    prepare: async () => {
      const id = await project()
      await a.clients.owner.post(`/api/projects/${id}/archive`)
      return { path: `/api/projects/${id}/restore` }
    },
  },
  'GET /api/projects/:id/activity': { expect: read, prepare: async () => ({ path: `/api/projects/${await project()}/activity` }) },
  'GET /api/projects/:id/circuits': { expect: read, prepare: async () => ({ path: `/api/projects/${await project()}/circuits` }) },
  'POST /api/projects/:id/circuits': { expect: write(201), prepare: async () => ({ path: `/api/projects/${await project()}/circuits`, body: { kind: 'coolant', title: 'Matrix cooling' } }) },
  'POST /api/projects/:id/circuits/import': { expect: write(201), prepare: async () => ({ path: `/api/projects/${await project()}/circuits/import`, body: { document: demoDocument() } }) },

  // ── circuits
  'GET /api/circuits/:id': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit(null)).id}` }) },
  'PATCH /api/circuits/:id': { expect: write(200), prepare: async () => ({ path: `/api/circuits/${(await circuit(null)).id}`, body: { title: 'Renamed' } }) },
  'DELETE /api/circuits/:id': {
    expect: write(200),
    prepare: async () => {
      const c = await circuit(null)
      return { path: `/api/circuits/${c.id}`, body: { confirmTitle: c.title } }
    },
  },
  'GET /api/circuits/:id/graph': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/graph` }) },
  'PUT /api/circuits/:id/graph': { expect: write(200), prepare: async () => ({ path: `/api/circuits/${(await circuit(null)).id}/graph`, body: { baseVersion: 1, document: demoDocument() } }) },
  'GET /api/circuits/:id/export': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/export` }) },
  'GET /api/circuits/:id/diff': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/diff?from=1&to=2` }) },
  'GET /api/circuits/:id/revisions': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/revisions` }) },
  'GET /api/circuits/:id/revisions/:version': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/revisions/2` }) },
  'GET /api/circuits/:id/photos': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/photos` }) },
  'POST /api/circuits/:id/photos': { expect: write(201), prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/photos`, upload: true }) },
  'DELETE /api/circuits/:id/photos/:photoId': {
    expect: write(200),
    prepare: async () => {
      const c = await circuit()
      return { path: `/api/circuits/${c.id}/photos/${(await uploadPhoto(a.clients.fabricator, c.id)).body.id}` }
    },
  },
  'GET /api/circuits/:id/photos/:photoId/image': {
    expect: read,
    prepare: async () => {
      const c = await circuit()
      return { path: `/api/circuits/${c.id}/photos/${(await uploadPhoto(a.clients.fabricator, c.id)).body.id}/image` }
    },
  },
  'GET /api/circuits/:id/photos/:photoId/thumbnail': {
    expect: read,
    prepare: async () => {
      const c = await circuit()
      return { path: `/api/circuits/${c.id}/photos/${(await uploadPhoto(a.clients.fabricator, c.id)).body.id}/thumbnail` }
    },
  },

  // ── review
  'GET /api/reviews': { expect: ownWorkshop('200 200 200 200'), prepare: async () => ({ path: '/api/reviews?state=in-review' }) },
  'GET /api/circuits/:id/reviews': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit(correctedDemoDocument(), { submit: true })).id}/reviews` }) },
  'POST /api/circuits/:id/reviews': { expect: write(201), prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/reviews`, body: { version: 2 } }) },
  'GET /api/reviews/:id': { expect: read, prepare: async () => ({ path: `/api/reviews/${(await circuit(correctedDemoDocument(), { submit: true })).reviewId}` }) },
  'POST /api/reviews/:id/approve': { expect: decide(200), prepare: async () => ({ path: `/api/reviews/${(await circuit(correctedDemoDocument(), { submit: true })).reviewId}/approve`, body: {} }) },
  'POST /api/reviews/:id/request-changes': { expect: decide(200), prepare: async () => ({ path: `/api/reviews/${(await circuit(demoDocument(), { submit: true })).reviewId}/request-changes`, body: { note: 'Cap the outlet.' } }) },
  'POST /api/reviews/:id/acknowledgements': { expect: decide(201), prepare: async () => ({ path: `/api/reviews/${await withWarning()}/acknowledgements`, body: { findingKey: AIR_TRAP, justification: 'Bleeds through the heater screw.' } }) },
  'DELETE /api/reviews/:id/acknowledgements/:ackId': {
    expect: decide(200),
    prepare: async () => {
      const reviewId = await withWarning()
      const ack = await a.clients.reviewer.post(`/api/reviews/${reviewId}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Bleeds through the heater screw.' })
      return { path: `/api/reviews/${reviewId}/acknowledgements/${ack.body.id}` }
    },
  },

  // ── comments (written by the fabricator: only the author edits; the author or an owner deletes)
  'GET /api/circuits/:id/comments': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/comments` }) },
  'GET /api/circuits/:id/comments/people': { expect: read, prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/comments/people` }) },
  'POST /api/circuits/:id/comments': { expect: '201 201 201 201 | 404 404 404 404 | 401', prepare: async () => ({ path: `/api/circuits/${(await circuit()).id}/comments`, body: { body: 'Is this clamp right?', version: 2 } }) },
  'PATCH /api/comments/:id': { expect: '403 200 403 403 | 404 404 404 404 | 401', prepare: async () => ({ path: `/api/comments/${await comment()}`, body: { body: 'Edited words' } }) },
  'DELETE /api/comments/:id': { expect: '200 200 403 403 | 404 404 404 404 | 401', prepare: async () => ({ path: `/api/comments/${await comment()}` }) },
  'POST /api/comments/:id/resolve': { expect: read, prepare: async () => ({ path: `/api/comments/${await comment()}/resolve` }) },
  'POST /api/comments/:id/reopen': {
    expect: read,
    prepare: async () => {
      const id = await comment()
      await a.clients.owner.post(`/api/comments/${id}/resolve`)
      return { path: `/api/comments/${id}/reopen` }
    },
  },

  // ── part templates
  'GET /api/templates': { expect: ownWorkshop('200 200 200 200'), prepare: async () => ({ path: '/api/templates' }) },
  'POST /api/templates': {
    expect: ownWorkshop('201 201 403 403'),
    prepare: async () => ({ path: '/api/templates', body: { name: `Matrix tee ${++n}`, body: templateFromComponent(demoDocument().circuit.components.find(c => c.id === 'thermostat')!) } }),
  },
  'GET /api/templates/:id': { expect: read, prepare: async () => ({ path: `/api/templates/${await template()}` }) },
  'PATCH /api/templates/:id': { expect: write(200), prepare: async () => ({ path: `/api/templates/${await template()}`, body: { name: `Matrix renamed ${++n}` } }) },
  'DELETE /api/templates/:id': { expect: write(200), prepare: async () => ({ path: `/api/templates/${await template()}` }) },

  // ── shop outputs of an approved version: everyone reads; reviewers do not record
  'GET /api/circuits/:id/versions/:version/shop': { expect: read, prepare: async () => ({ path: await shopOf() }) },
  'GET /api/circuits/:id/versions/:version/shop/shopping-list.csv': { expect: read, prepare: async () => ({ path: `${await shopOf()}/shopping-list.csv` }) },
  'GET /api/circuits/:id/versions/:version/shop/build-sheet.pdf': { expect: read, prepare: async () => ({ path: `${await shopOf()}/build-sheet.pdf` }) },
  'PATCH /api/circuits/:id/versions/:version/shop/lines': { expect: record(200), prepare: async () => ({ path: `${await shopOf()}/lines`, body: { lineId: 'hose/j20-r3-heater/15.88', bought: true } }) },
  'POST /api/circuits/:id/versions/:version/shop/lines': { expect: record(201), prepare: async () => ({ path: `${await shopOf()}/lines`, body: { description: 'Cable ties', quantity: 1, unit: 'pack' } }) },
  'DELETE /api/circuits/:id/versions/:version/shop/lines': {
    expect: record(204),
    prepare: async () => {
      const base = await shopOf()
      const line = await a.clients.owner.post(`${base}/lines`, { description: 'Cable ties', quantity: 1, unit: 'pack' })
      return { path: `${base}/lines?lineId=${encodeURIComponent(line.body.lineId ?? line.body.id)}` }
    },
  },
  'POST /api/circuits/:id/versions/:version/shop/steps': { expect: record(200), prepare: async () => ({ path: `${await shopOf()}/steps`, body: { stepId: 'caution/hot-cap', done: true } }) },
  'POST /api/circuits/:id/versions/:version/shop/pressure-tests': {
    expect: record(201),
    prepare: async () => ({ path: `${await shopOf()}/pressure-tests`, body: { unit: 'bar', startPressure: 1.1, endPressure: 1.1, minutesHeld: 2, passed: true } }),
  },
  'POST /api/circuits/:id/versions/:version/shop/fills': { expect: record(201), prepare: async () => ({ path: `${await shopOf()}/fills`, body: { unit: 'L', volume: 8 } }) },
}

const statusesOf = (line: string) => line.replaceAll('|', ' ').split(/\s+/).filter(Boolean).map(Number)

describe('access matrix', () => {
  const routes = apiRoutes()

  it('has a line for every route under server/api, and none for a route that is gone', () => {
    expect(routes.map(r => r.key).filter(k => !(k in rows)), 'routes without a line').toEqual([])
    expect(Object.keys(rows).filter(k => !routes.some(r => r.key === k)), 'lines without a route').toEqual([])
    for (const [key, row] of Object.entries(rows)) expect(statusesOf(row.expect), key).toHaveLength(WHO.length)
  })

  for (const route of routes) {
    it(route.key, async () => {
      const row = rows[route.key]
      if (!row) throw new Error(`no line in the access matrix for ${route.key}`)
      const expected = statusesOf(row.expect)
      const got: number[] = []
      for (const who of WHO) {
        const client = clientOf(who)
        const c = await row.prepare(who, client)
        // a copy of the session: an answer that sets a cookie (sign-up, switching) must not change who the next case is
        const by = c.as ?? Object.assign(new Client(client.forwardedFor), { cookies: new Map(client.cookies) })
        const res = c.upload ? await uploadPhoto(by, c.path.split('/')[3]!) : await by.request(c.method ?? route.method, c.path, c.body ?? (route.method === 'GET' || route.method === 'DELETE' ? undefined : {}))
        got.push(res.status)
        await c.after?.()
      }
      expect(Object.fromEntries(WHO.map((w, i) => [w, got[i]])), route.key).toEqual(Object.fromEntries(WHO.map((w, i) => [w, expected[i]])))
    }, 120_000)
  }
})
