import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { applyFix, type CircuitDocument } from '#shared/circuit'
import { demoDocument } from '#shared/demo'
import { Client, addMember, signUp } from '../helpers/http'
import { waitForMail, linkFrom } from '../helpers/mail'
import { sql } from '../helpers/db'

// The whole review before the first fill, as the workshop does it: the fabricator submits the demo
// circuit (its open third outlet is an error, the heater high point a warning), the reviewer is
// stopped by the error, asks for changes, the fabricator caps the outlet and submits again, the
// reviewer signs the warning off and approves; a later save stays a draft.
afterAll(() => sql.end())

let owner: Client
let fab: Client
let rev: Client
let tech: Client
let emails: Record<'owner' | 'fab' | 'rev' | 'tech', string>
let circuitId: string
let projectId: string
const OPEN_PORT = 'open-port|engine,engine-third'
const AIR_TRAP = 'air-trap|heater,heater-inlet,heater-outlet'

beforeAll(async () => {
  const o = await signUp('rvowner', 'Review flow shop')
  owner = o.client
  const [f, r, t] = await Promise.all([addMember(owner, 'fabricator', 'rvfab'), addMember(owner, 'reviewer', 'rvrev'), addMember(owner, 'technician', 'rvtech')])
  fab = f.client; rev = r.client; tech = t.client
  emails = { owner: o.email, fab: f.email, rev: r.email, tech: t.email }
  projectId = (await fab.post('/api/projects', { title: 'Review flow build' })).body.id
  circuitId = (await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Cooling' })).body.id
})

async function save(client: Client, doc: CircuitDocument) {
  const base = (await client.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version
  const res = await client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: base, document: doc })
  expect(res.status).toBe(200)
  return res.body.version as number
}

describe('review before the first fill', () => {
  let firstReview: string
  let secondReview: string
  let v2: number
  let v3: number

  it('only the current saved version can be submitted', async () => {
    const doc = demoDocument()
    doc.circuit.title = 'Cooling'
    v2 = await save(fab, doc)
    const older = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v2 - 1 })
    expect(older.status).toBe(409)
    expect(older.body.statusMessage).toBe('A newer version exists')
    const unsaved = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v2 + 1 })
    expect(unsaved.status).toBe(409)
    expect(unsaved.body.statusMessage).toBe('Save first')
    const bad = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: 'two' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.version).toBeTruthy()
  })

  it('submitting freezes the version and asks the reviewers and owners (not the submitter) by e-mail', async () => {
    const res = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v2, note: 'First go, please look at the heater.' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ state: 'in-review', version: v2, summary: { error: 1, warning: 1, note: 0 } })
    firstReview = res.body.id
    const again = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v2 })
    expect(again.status).toBe(409)
    const queued = await sql`select to_address from mail_outbox where kind = 'review-requested' and text_body like ${`%/reviews/${firstReview}%`}`
    expect(queued.map(r => r.to_address).sort()).toEqual([emails.owner, emails.rev].sort())
    const mail = await waitForMail(emails.rev, { subject: 'Review wanted: Cooling' })
    expect(mail.text).toContain('First go, please look at the heater.')
    expect(linkFrom(mail, '/reviews/').pathname).toBe(`/reviews/${firstReview}`)
    expect(mail.html).toContain('<blockquote')
  })

  it('the reviewer sees the frozen version with its findings and quantities, from the same engine', async () => {
    const res = await rev.get(`/api/reviews/${firstReview}`)
    expect(res.status).toBe(200)
    expect(res.body.document.circuit.hoses.length).toBe(demoDocument().circuit.hoses.length)
    expect(res.body.findings.map((f: any) => [f.key, f.severity])).toEqual([[OPEN_PORT, 'error'], [AIR_TRAP, 'warning']])
    expect(res.body.blockers).toEqual({ errors: [OPEN_PORT], unacknowledged: [AIR_TRAP] })
    expect(res.body.canApprove).toBe(false)
    expect(res.body.viewer.mayDecide).toBe(true)
    expect(res.body.report.quantities.hoses).toHaveLength(demoDocument().circuit.hoses.length)
    // the fabricator who submitted may not decide it
    expect((await fab.get(`/api/reviews/${firstReview}`)).body.viewer.mayDecide).toBe(false)
  })

  it('a warning needs a real reason; an error cannot be signed off', async () => {
    const short = await rev.post(`/api/reviews/${firstReview}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'fine' })
    expect(short.status).toBe(400)
    expect(short.body.data.fields.justification).toMatch(/10 characters/)
    const error = await rev.post(`/api/reviews/${firstReview}/acknowledgements`, { findingKey: OPEN_PORT, justification: 'We will cap it later on.' })
    expect(error.status).toBe(400)
    expect(error.body.data.fields.findingKey).toMatch(/fixed/)
    const unknown = await rev.post(`/api/reviews/${firstReview}/acknowledgements`, { findingKey: 'air-trap|nothing', justification: 'Long enough reason.' })
    expect(unknown.status).toBe(400)
    const ok = await rev.post(`/api/reviews/${firstReview}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Heater core bleeds through its own screw.' })
    expect(ok.status).toBe(201)
  })

  it('the error blocks approval (409 with the list); the reviewer asks for changes with a note', async () => {
    const blocked = await rev.post(`/api/reviews/${firstReview}/approve`, { note: 'Looks fine' })
    expect(blocked.status).toBe(409)
    expect(blocked.body.data.errors.map((f: any) => f.key)).toEqual([OPEN_PORT])
    expect((await rev.get(`/api/reviews/${firstReview}`)).body.review.state).toBe('in-review')
    const noNote = await rev.post(`/api/reviews/${firstReview}/request-changes`, { note: '  ' })
    expect(noNote.status).toBe(400)
    expect(noNote.body.data.fields.note).toBeTruthy()
    const sent = await rev.post(`/api/reviews/${firstReview}/request-changes`, { note: 'Cap the third outlet with a 16 mm blanking cap.' })
    expect(sent.status).toBe(200)
    expect(sent.body.state).toBe('changes-requested')
    const mail = await waitForMail(emails.fab, { subject: 'Changes wanted: Cooling' })
    expect(mail.text).toContain('Cap the third outlet with a 16 mm blanking cap.')
    expect(linkFrom(mail, '/reviews/').pathname).toBe(`/reviews/${firstReview}`)
    // decided: nothing more can be signed on it
    expect((await rev.post(`/api/reviews/${firstReview}/approve`, {})).status).toBe(409)
  })

  it('the fabricator caps the outlet, saves and submits the new version', async () => {
    const graph = (await fab.get(`/api/circuits/${circuitId}/graph`)).body
    const openPort = graph.report.findings.find((f: any) => f.code === 'open-port')
    const fixed = applyFix(graph.document, openPort.fix.action).doc
    v3 = await save(fab, fixed)
    const res = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v3, note: 'Outlet capped.' })
    expect(res.status).toBe(201)
    expect(res.body.summary).toEqual({ error: 0, warning: 1, note: 0 })
    secondReview = res.body.id
  })

  it('sign-offs belong to one review: the new one needs the warning signed again, then approves', async () => {
    const blocked = await rev.post(`/api/reviews/${secondReview}/approve`, {})
    expect(blocked.status).toBe(409)
    expect(blocked.body.data.unacknowledged.map((f: any) => f.key)).toEqual([AIR_TRAP])
    // a technician cannot sign off
    expect((await tech.post(`/api/reviews/${secondReview}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Looks fine to me here.' })).status).toBe(403)
    const ack = await rev.post(`/api/reviews/${secondReview}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Heater bleeds through the screw on its top hose.' })
    expect(ack.status).toBe(201)
    const approved = await rev.post(`/api/reviews/${secondReview}/approve`, { note: 'Good to fill.' })
    expect(approved.status).toBe(200)
    expect(approved.body).toMatchObject({ state: 'approved', version: v3, decisionNote: 'Good to fill.' })
    const again = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v3 })
    expect(again.status).toBe(409)
    expect(again.body.statusMessage).toBe('Already approved')
    const mail = await waitForMail(emails.fab, { subject: 'Approved: Cooling' })
    expect(mail.text).toContain('Good to fill.')
  })

  it('the approval stays on its version after a later save; every screen says which version is approved', async () => {
    const later = structuredClone((await fab.get(`/api/circuits/${circuitId}/graph`)).body.document) as CircuitDocument
    later.circuit.notes = 'Moved the tank 20 mm.'
    const v4 = await save(fab, later)
    const graph = (await tech.get(`/api/circuits/${circuitId}/graph`)).body
    expect(graph.reviewStatus).toMatchObject({
      currentVersion: v4, draftAfterApproval: true, open: null,
      approved: { reviewId: secondReview, version: v3, by: { name: 'Test rvrev' } },
      latest: { reviewId: secondReview, state: 'approved' },
    })
    const project = (await tech.get(`/api/projects/${projectId}`)).body
    expect(project.circuits[0].reviewStatus.approved.version).toBe(v3)
    // the approved review still shows version v3 exactly as it was saved
    const frozen = (await tech.get(`/api/reviews/${secondReview}`)).body
    expect(frozen.document).toEqual((await tech.get(`/api/circuits/${circuitId}/revisions/${v3}`)).body.document)
    expect(frozen.document.circuit.notes).not.toBe('Moved the tank 20 mm.')
  })

  it('a new submission supersedes an open one; the approval of the older version stands', async () => {
    const v4 = (await fab.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version
    const third = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v4 })
    expect(third.status).toBe(201)
    const doc = (await fab.get(`/api/circuits/${circuitId}/graph`)).body.document
    doc.circuit.notes = 'Tank back where it was.'
    const v5 = await save(fab, doc)
    const fourth = await fab.post(`/api/circuits/${circuitId}/reviews`, { version: v5 })
    expect(fourth.status).toBe(201)
    const list = (await rev.get(`/api/circuits/${circuitId}/reviews`)).body
    expect(list.reviews.map((r: any) => [r.version, r.state])).toEqual([[v5, 'in-review'], [v4, 'superseded'], [v3, 'approved'], [v2, 'changes-requested']])
    expect(list.reviewStatus).toMatchObject({ approved: { version: v3 }, open: { reviewId: fourth.body.id, version: v5 } })
    const [open] = await sql`select count(*)::int as n from reviews where circuit_id = ${circuitId} and state = 'in-review'`
    expect(open!.n).toBe(1)
    // the superseded review can no longer be decided
    expect((await rev.post(`/api/reviews/${third.body.id}/request-changes`, { note: 'Too late for this one.' })).status).toBe(409)
  })
})
