import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import { applyFix, type CircuitDocument } from '#shared/circuit'
import { analyzeCircuit } from '#shared/engine'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Who may use each review, comment, diff, activity and settings route: every role of the workshop,
// a member of another workshop, and nobody signed in. Another workshop's rows answer 404, as if
// they did not exist. Each case gets fresh rows, so no case depends on another.
afterAll(() => sql.end())

type Who = 'owner' | 'fabricator' | 'reviewer' | 'technician' | 'other' | 'anon'
const WHO: Who[] = ['owner', 'fabricator', 'reviewer', 'technician', 'other', 'anon']
const clients = {} as Record<Who, Client>
let workshopId: string
let projectId: string
let fab2: Client

beforeAll(async () => {
  const o = await signUp('permowner', 'Permission shop')
  clients.owner = o.client
  workshopId = o.summary.workshop.id
  const [f, r, t, f2] = await Promise.all(['fabricator', 'reviewer', 'technician', 'fabricator'].map((role, i) => addMember(o.client, role, `perm${i}`)))
  clients.fabricator = f!.client; clients.reviewer = r!.client; clients.technician = t!.client; fab2 = f2!.client
  clients.other = (await signUp('permother', 'Another shop')).client
  clients.anon = new Client()
  projectId = (await clients.owner.post('/api/projects', { title: 'Permission build' })).body.id
})

/** A circuit saved with `doc` (version 2), optionally put up for review by the second fabricator. */
async function circuit(doc: CircuitDocument, submit = false) {
  const id = (await clients.owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Perm circuit' })).body.id as string
  expect((await clients.owner.put(`/api/circuits/${id}/graph`, { baseVersion: 1, document: doc })).status).toBe(200)
  const reviewId = submit ? (await fab2.post(`/api/circuits/${id}/reviews`, { version: 2 })).body.id as string : ''
  return { id, reviewId }
}
const withWarningOnly = () => {
  const doc = demoDocument()
  const fix = analyzeCircuit(doc).findings.find(f => f.code === 'open-port')!.fix.action!
  return applyFix(doc, fix).doc
}
const AIR_TRAP = 'air-trap|heater,heater-inlet,heater-outlet'
async function comment(circuitId: string, by: Client) {
  return (await by.post(`/api/circuits/${circuitId}/comments`, { body: 'Check this clamp', version: 2, anchor: { kind: 'component', elementId: 'engine' } })).body.id as string
}

interface Case { method: string; path: string; body?: unknown }
interface Row { route: string; prepare: () => Promise<Case>; expect: Record<Who, number> }
const read = (ok = 200) => ({ owner: ok, fabricator: ok, reviewer: ok, technician: ok, other: 404, anon: 401 })
const decide = { owner: 200, fabricator: 403, reviewer: 200, technician: 403, other: 404, anon: 401 }

const rows: Row[] = [
  { route: 'GET /api/circuits/:id/reviews', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/circuits/${(await circuit(demoDocument(), true)).id}/reviews` }) },
  {
    route: 'POST /api/circuits/:id/reviews', expect: { owner: 201, fabricator: 201, reviewer: 403, technician: 403, other: 404, anon: 401 },
    prepare: async () => ({ method: 'POST', path: `/api/circuits/${(await circuit(demoDocument())).id}/reviews`, body: { version: 2 } }),
  },
  { route: 'GET /api/reviews/:id', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/reviews/${(await circuit(demoDocument(), true)).reviewId}` }) },
  { route: 'GET /api/reviews?state=in-review', expect: { ...read(), other: 200 }, prepare: async () => ({ method: 'GET', path: '/api/reviews?state=in-review' }) },
  // the second fabricator submitted these: the first fabricator is not the submitter and still may not decide
  { route: 'POST /api/reviews/:id/approve', expect: decide, prepare: async () => ({ method: 'POST', path: `/api/reviews/${(await circuit(correctedDemoDocument(), true)).reviewId}/approve`, body: {} }) },
  {
    route: 'POST /api/reviews/:id/request-changes', expect: decide,
    prepare: async () => ({ method: 'POST', path: `/api/reviews/${(await circuit(demoDocument(), true)).reviewId}/request-changes`, body: { note: 'Cap the outlet.' } }),
  },
  {
    route: 'POST /api/reviews/:id/acknowledgements', expect: { ...decide, owner: 201, reviewer: 201 },
    prepare: async () => ({ method: 'POST', path: `/api/reviews/${(await circuit(withWarningOnly(), true)).reviewId}/acknowledgements`, body: { findingKey: AIR_TRAP, justification: 'Bleeds through the heater screw.' } }),
  },
  {
    route: 'DELETE /api/reviews/:id/acknowledgements/:ackId', expect: decide,
    prepare: async () => {
      const { reviewId } = await circuit(withWarningOnly(), true)
      const ack = await clients.reviewer.post(`/api/reviews/${reviewId}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Bleeds through the heater screw.' })
      return { method: 'DELETE', path: `/api/reviews/${reviewId}/acknowledgements/${ack.body.id}` }
    },
  },
  { route: 'GET /api/circuits/:id/comments', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/circuits/${(await circuit(demoDocument())).id}/comments` }) },
  { route: 'GET /api/circuits/:id/comments/people', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/circuits/${(await circuit(demoDocument())).id}/comments/people` }) },
  {
    route: 'POST /api/circuits/:id/comments', expect: read(201),
    prepare: async () => ({ method: 'POST', path: `/api/circuits/${(await circuit(demoDocument())).id}/comments`, body: { body: 'Is this clamp right?', version: 2 } }),
  },
  // comments written by the fabricator: only the author edits; the author or an owner deletes
  {
    route: 'PATCH /api/comments/:id', expect: { owner: 403, fabricator: 200, reviewer: 403, technician: 403, other: 404, anon: 401 },
    prepare: async () => ({ method: 'PATCH', path: `/api/comments/${await comment((await circuit(demoDocument())).id, clients.fabricator)}`, body: { body: 'Edited words' } }),
  },
  {
    route: 'DELETE /api/comments/:id', expect: { owner: 200, fabricator: 200, reviewer: 403, technician: 403, other: 404, anon: 401 },
    prepare: async () => ({ method: 'DELETE', path: `/api/comments/${await comment((await circuit(demoDocument())).id, clients.fabricator)}` }),
  },
  { route: 'POST /api/comments/:id/resolve', expect: read(), prepare: async () => ({ method: 'POST', path: `/api/comments/${await comment((await circuit(demoDocument())).id, clients.fabricator)}/resolve` }) },
  {
    route: 'POST /api/comments/:id/reopen', expect: read(),
    prepare: async () => {
      const id = await comment((await circuit(demoDocument())).id, clients.fabricator)
      await clients.owner.post(`/api/comments/${id}/resolve`)
      return { method: 'POST', path: `/api/comments/${id}/reopen` }
    },
  },
  { route: 'GET /api/circuits/:id/diff', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/circuits/${(await circuit(demoDocument())).id}/diff?from=1&to=2` }) },
  { route: 'GET /api/projects/:id/activity', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/projects/${projectId}/activity` }) },
  { route: 'GET /api/workshops/:id/settings', expect: read(), prepare: async () => ({ method: 'GET', path: `/api/workshops/${workshopId}/settings` }) },
  {
    route: 'PATCH /api/workshops/:id/settings', expect: { owner: 200, fabricator: 403, reviewer: 403, technician: 403, other: 404, anon: 401 },
    prepare: async () => ({ method: 'PATCH', path: `/api/workshops/${workshopId}/settings`, body: { fabricatorMayApproveOwn: false } }),
  },
]

describe('permission matrix of the review routes', () => {
  for (const row of rows) {
    for (const who of WHO) {
      it(`${row.route} as ${who} → ${row.expect[who]}`, async () => {
        const c = await row.prepare()
        const res = await clients[who].request(c.method, c.path, c.body)
        expect(res.status, JSON.stringify(res.body)).toBe(row.expect[who])
      })
    }
  }

  it('the open-review list of another workshop shows none of ours', async () => {
    const { reviewId } = await circuit(demoDocument(), true)
    const ours = (await clients.technician.get('/api/reviews?state=in-review')).body.reviews.map((r: any) => r.id)
    const theirs = (await clients.other.get('/api/reviews?state=in-review')).body.reviews.map((r: any) => r.id)
    expect(ours).toContain(reviewId)
    expect(theirs).not.toContain(reviewId)
  })
})

describe('approving one’s own submission', () => {
  it('is refused for everyone while the setting is off, owners too', async () => {
    const { id } = await circuit(correctedDemoDocument())
    const own = await clients.owner.post(`/api/circuits/${id}/reviews`, { version: 2 })
    const res = await clients.owner.post(`/api/reviews/${own.body.id}/approve`, {})
    expect(res.status).toBe(403)
    expect(res.body.data.reason).toBe('own-submission')
    const byFab = await fab2.post(`/api/reviews/${(await circuit(correctedDemoDocument(), true)).reviewId}/approve`, {})
    expect(byFab.status).toBe(403)
  })

  it('with the setting on, a fabricator approves their own, still not someone else’s', async () => {
    expect((await clients.owner.patch(`/api/workshops/${workshopId}/settings`, { fabricatorMayApproveOwn: true })).body.review.fabricatorMayApproveOwn).toBe(true)
    try {
      const { reviewId } = await circuit(correctedDemoDocument(), true)
      expect((await clients.fabricator.post(`/api/reviews/${reviewId}/approve`, {})).status).toBe(403)
      const own = await fab2.post(`/api/reviews/${reviewId}/approve`, { note: 'Checked it twice myself.' })
      expect(own.status).toBe(200)
      expect((await clients.technician.get(`/api/workshops/${workshopId}/settings`)).body.review.fabricatorMayApproveOwn).toBe(true)
    } finally {
      await clients.owner.patch(`/api/workshops/${workshopId}/settings`, { fabricatorMayApproveOwn: false })
    }
  })

  it('bad settings input answers 400 with the field', async () => {
    const res = await clients.owner.patch(`/api/workshops/${workshopId}/settings`, { fabricatorMayApproveOwn: 'yes' })
    expect(res.status).toBe(400)
    expect(res.body.data.fields.fabricatorMayApproveOwn).toBeTruthy()
    expect((await clients.owner.patch(`/api/workshops/${workshopId}/settings`, {})).status).toBe(400)
  })
})
