import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { correctedDemoDocument } from '#shared/demo'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Decisions race: reviewers click at the same moment, a fabricator double-submits. Exactly one of
// each wins; the rest get 409 and nothing is written twice (no second approval, mail or log line).
afterAll(() => sql.end())

let owner: Client
let fab: Client
let reviewers: Client[]
let projectId: string

beforeAll(async () => {
  owner = (await signUp('raceowner')).client
  fab = (await addMember(owner, 'fabricator', 'racefab')).client
  reviewers = await Promise.all([1, 2, 3].map(async i => (await addMember(owner, 'reviewer', `racerev${i}`)).client))
  projectId = (await fab.post('/api/projects', { title: 'Race build' })).body.id
})

async function savedCircuit() {
  const id = (await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Race cooling' })).body.id as string
  expect((await fab.put(`/api/circuits/${id}/graph`, { baseVersion: 1, document: correctedDemoDocument() })).status).toBe(200)
  return id
}

describe('concurrent review actions', () => {
  it('many approvals of one review at once: exactly one succeeds', async () => {
    const circuitId = await savedCircuit()
    const reviewId = (await fab.post(`/api/circuits/${circuitId}/reviews`, { version: 2 })).body.id
    const deciders = [...reviewers, owner, ...reviewers, owner]
    const answers = await Promise.all(deciders.map((c, i) => c.post(`/api/reviews/${reviewId}/approve`, { note: `approval ${i}` })))
    expect(answers.filter(a => a.status === 200)).toHaveLength(1)
    expect(answers.filter(a => a.status === 409)).toHaveLength(deciders.length - 1)
    const winner = answers.find(a => a.status === 200)!
    const [row] = await sql`select state, decision_note from reviews where id = ${reviewId}`
    expect(row).toEqual({ state: 'approved', decision_note: winner.body.decisionNote })
    const [logged] = await sql`select count(*)::int as n from activity where action = 'review.approved' and details->>'reviewId' = ${reviewId}`
    expect(logged!.n).toBe(1)
    const [mails] = await sql`select count(*)::int as n from mail_outbox where kind = 'review-approved' and text_body like ${`%/reviews/${reviewId}%`}`
    expect(mails!.n).toBe(1)
  })

  it('approve and request changes at once: one decision stands', async () => {
    const circuitId = await savedCircuit()
    const reviewId = (await fab.post(`/api/circuits/${circuitId}/reviews`, { version: 2 })).body.id
    const answers = await Promise.all(reviewers.flatMap((c, i) => [
      c.post(`/api/reviews/${reviewId}/approve`, {}),
      c.post(`/api/reviews/${reviewId}/request-changes`, { note: `change ${i}` }),
    ]))
    const won = answers.filter(a => a.status === 200)
    expect(won).toHaveLength(1)
    const [row] = await sql`select state from reviews where id = ${reviewId}`
    expect(row!.state).toBe(won[0]!.body.state)
  })

  it('the same version submitted many times at once: one open review', async () => {
    const circuitId = await savedCircuit()
    const answers = await Promise.all(Array.from({ length: 6 }, () => fab.post(`/api/circuits/${circuitId}/reviews`, { version: 2 })))
    expect(answers.filter(a => a.status === 201)).toHaveLength(1)
    expect(answers.filter(a => a.status === 409)).toHaveLength(5)
    const rows = await sql`select state from reviews where circuit_id = ${circuitId}`
    expect(rows).toEqual([{ state: 'in-review' }])
  })
})
