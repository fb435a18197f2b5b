// A workshop of four (owner, fabricator, reviewer, technician, each invited by mail as a person
// would be) and one of everything in it, for the suites that go over every route.
import sharp from 'sharp'
import { expect } from 'vitest'
import { applyFix, type CircuitDocument } from '#shared/circuit'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { templateFromComponent } from '#shared/schemas/template'
import { Client, addMember, baseUrl, signUp, uniqueEmail } from './http'

export const ROLES = ['owner', 'fabricator', 'reviewer', 'technician'] as const
export type Role = (typeof ROLES)[number]

export interface Workshop {
  workshopId: string
  clients: Record<Role, Client>
  emails: Record<Role, string>
  membershipIds: Record<Role, string>
}

export async function workshopOfFour(tag: string): Promise<Workshop> {
  const o = await signUp(`${tag}owner`, `Workshop ${tag}`)
  const [f, r, t] = await Promise.all((['fabricator', 'reviewer', 'technician'] as const).map(role => addMember(o.client, role, `${tag}${role}`)))
  const ownerId = (await o.client.get('/api/members')).body.find((m: { role: string }) => m.role === 'owner').id as string
  return {
    workshopId: o.summary.workshop.id,
    clients: { owner: o.client, fabricator: f!.client, reviewer: r!.client, technician: t!.client },
    emails: { owner: o.email, fabricator: f!.email, reviewer: r!.email, technician: t!.email },
    membershipIds: { owner: ownerId, fabricator: f!.membershipId, reviewer: r!.membershipId, technician: t!.membershipId },
  }
}

/** The demo with its one error fixed: only a warning (an air trap at the heater) is left. */
export function warningOnlyDocument(): CircuitDocument {
  const doc = demoDocument()
  const fix = analyzeCircuit(doc).findings.find(f => f.code === 'open-port')!.fix.action!
  return applyFix(doc, fix).doc
}
export const AIR_TRAP = 'air-trap|heater,heater-inlet,heater-outlet'

let png: Buffer | undefined
export async function uploadPhoto(client: Client, circuitId: string): Promise<{ status: number; body: any }> {
  png ??= await sharp({ create: { width: 8, height: 8, channels: 3, background: '#0d6b73' } }).png().toBuffer()
  const form = new FormData()
  form.append('componentId', 'radiator')
  form.append('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'radiator.png')
  const res = await fetch(`${baseUrl}/api/circuits/${circuitId}/photos`, {
    method: 'POST', body: form,
    headers: { accept: 'application/json', cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
  })
  return { status: res.status, body: await res.json() }
}

export interface Things {
  projectId: string
  /** the corrected demo, saved as version 2, submitted by the fabricator and approved */
  circuitId: string
  version: number
  reviewId: string
  /** a second circuit with a warning left, in review, with an acknowledgement by the reviewer */
  openCircuitId: string
  openReviewId: string
  ackId: string
  commentId: string
  templateId: string
  photoId: string
  invitationId: string
  outboxId: string
}

/** One of every kind of row, made by the roles that make them in the workshop. */
export async function makeThings(w: Workshop, tag: string): Promise<Things> {
  const { owner, fabricator: fab, reviewer: rev } = w.clients
  const ok = <T extends { status: number }>(res: T, what: string) => {
    expect(res.status, what).toBeLessThan(300)
    return res as T & { body: any }
  }
  const projectId = ok(await fab.post('/api/projects', { title: `Build ${tag}` }), 'project').body.id
  const circuit = async (doc: CircuitDocument, title: string) => {
    const id = ok(await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title }), 'circuit').body.id as string
    doc.circuit.title = title
    const saved = ok(await fab.put(`/api/circuits/${id}/graph`, { baseVersion: 1, document: doc }), 'save')
    const reviewId = ok(await fab.post(`/api/circuits/${id}/reviews`, { version: saved.body.version, note: 'Ready.' }), 'review').body.id as string
    return { id, version: saved.body.version as number, reviewId }
  }
  const approved = await circuit(correctedDemoDocument(), `Cooling ${tag}`)
  ok(await rev.post(`/api/reviews/${approved.reviewId}/approve`, { note: 'Good to fill.' }), 'approve')
  const open = await circuit(warningOnlyDocument(), `Cooling ${tag} (open)`)
  const ackId = ok(await rev.post(`/api/reviews/${open.reviewId}/acknowledgements`, { findingKey: AIR_TRAP, justification: 'Bleeds through the heater screw.' }), 'ack').body.id
  const commentId = ok(await fab.post(`/api/circuits/${approved.id}/comments`, { body: 'Check this clamp', version: approved.version, anchor: { kind: 'component', elementId: 'engine' } }), 'comment').body.id
  const component = demoDocument().circuit.components.find(c => c.id === 'thermostat')!
  const templateId = ok(await fab.post('/api/templates', { name: `Thermostat ${tag}`, body: templateFromComponent(component) }), 'template').body.id
  const photoId = ok(await uploadPhoto(fab, approved.id), 'photo').body.id
  const invitee = uniqueEmail(`${tag}invitee`)
  const invitationId = ok(await owner.post('/api/members', { email: invitee, role: 'technician', name: 'Invited later' }), 'invitation').body.id
  const outboxId = ok(await owner.get('/api/outbox'), 'outbox').body.find((m: { to: string }) => m.to === invitee).id as string
  return {
    projectId, circuitId: approved.id, version: approved.version, reviewId: approved.reviewId,
    openCircuitId: open.id, openReviewId: open.reviewId, ackId, commentId, templateId, photoId, invitationId, outboxId,
  }
}
