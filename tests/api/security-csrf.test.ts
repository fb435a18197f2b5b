import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, Client, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Cross-site request forgery. The posture (DEVELOPERS.md, "Security"): the session cookie is
// SameSite=Lax; every state-changing request must be same-origin by Fetch Metadata or Origin
// (server/middleware/2.requestGuard.ts); API bodies are JSON only, multipart only for photo uploads.
// OWASP CSRF Prevention Cheat Sheet (from memory): SameSite cookies, Fetch Metadata / Origin
// verification, and content types a plain HTML form cannot send, as defence in depth.
afterAll(() => sql.end())

let owner: Client
let ownerId: string
beforeAll(async () => {
  const signed = await signUp('csrf')
  owner = signed.client
  ownerId = signed.summary.user.id
})

const projectsOf = async () => (await sql`select count(*)::int as n from projects p join memberships m on m.workshop_id = p.workshop_id where m.user_id = ${ownerId}`)[0]!.n as number

/** What a hostile page's auto-submitting form sends, with the victim's cookie attached by the browser. */
function formPost(path: string, fields: Record<string, string>, headers: Record<string, string>) {
  return owner.request('POST', path, new URLSearchParams(fields).toString(), { 'content-type': 'application/x-www-form-urlencoded', ...headers })
}

describe('cross-site requests are refused', () => {
  it('a cross-site form POST is refused with 403 and changes nothing', async () => {
    const before = await projectsOf()
    const res = await formPost('/api/projects', { title: 'Planted by another site' }, { origin: 'http://evil.example', 'sec-fetch-site': 'cross-site', 'sec-fetch-mode': 'navigate' })
    expect(res.status).toBe(403)
    // the same form from a browser without Fetch Metadata: the Origin header alone decides
    expect((await formPost('/api/projects', { title: 'Planted' }, { origin: 'http://evil.example' })).status).toBe(403)
    expect(await projectsOf()).toBe(before)
  })

  it('JSON from another origin, a same-site sibling or an opaque origin is refused too', async () => {
    const before = await projectsOf()
    for (const headers of [
      { origin: 'http://evil.example' },
      { 'sec-fetch-site': 'cross-site' },
      { 'sec-fetch-site': 'same-site', origin: 'http://other.127.0.0.1.example' },
      { origin: 'null' }, // sandboxed frames and some redirects
      { origin: baseUrl.replace('127.0.0.1', 'localhost') }, // another origin, even if the same machine
    ] as Array<Record<string, string>>) {
      const res = await owner.request('POST', '/api/projects', { title: 'Cross-site JSON' }, headers)
      expect(res.status, JSON.stringify(headers)).toBe(403)
    }
    expect(await projectsOf()).toBe(before)
  })

  it('sign-out, deletes and photo uploads from another site are refused (no logout or delete CSRF)', async () => {
    const projectId = (await owner.post('/api/projects', { title: 'Kept' })).body.id
    const circuitId = (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Kept circuit' })).body.id
    const evil = { origin: 'http://evil.example', 'sec-fetch-site': 'cross-site' }
    expect((await owner.request('DELETE', '/api/session', undefined, evil)).status).toBe(403)
    expect((await owner.request('DELETE', `/api/circuits/${circuitId}`, undefined, evil)).status).toBe(403)
    const form = new FormData()
    form.append('componentId', 'radiator')
    form.append('file', new Blob([new Uint8Array([0x89, 0x50, 0x4e, 0x47])], { type: 'image/png' }), 'x.png')
    const upload = await fetch(`${baseUrl}/api/circuits/${circuitId}/photos`, {
      method: 'POST', body: form, headers: { ...evil, cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    })
    expect(upload.status).toBe(403)
    expect((await owner.get(`/api/circuits/${circuitId}`)).status).toBe(200)
    expect((await owner.get('/api/session')).body.user.id).toBe(ownerId)
  })
})

describe('bodies a plain HTML form could send never reach a route', () => {
  it('urlencoded, text/plain and multipart outside uploads answer 415, even without an Origin', async () => {
    const before = await projectsOf()
    expect((await formPost('/api/projects', { title: 'Form' }, {})).status).toBe(415)
    expect((await owner.request('POST', '/api/projects', '{"title":"Plain text JSON"}', { 'content-type': 'text/plain' })).status).toBe(415)
    const form = new FormData()
    form.append('title', 'Multipart')
    const multipart = await fetch(`${baseUrl}/api/projects`, { method: 'POST', body: form, headers: { cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } })
    expect(multipart.status).toBe(415)
    expect(await projectsOf()).toBe(before)
  })
})

describe('what must keep working', () => {
  it('same-origin JSON from the browser (Fetch Metadata and Origin) works', async () => {
    const res = await owner.request('POST', '/api/projects', { title: 'Same origin' }, { origin: baseUrl, 'sec-fetch-site': 'same-origin' })
    expect(res.status).toBe(201)
  })

  it('a trusted proxy\'s forwarded host is this site\'s origin', async () => {
    // the test server runs with HOSEWRIGHT_TRUST_PROXY=1
    const res = await owner.request('POST', '/api/projects', { title: 'Behind a proxy' },
      { origin: 'https://hosewright.example.test', 'x-forwarded-host': 'hosewright.example.test', 'x-forwarded-proto': 'https' })
    expect(res.status).toBe(201)
  })

  it('clients without Origin or Fetch Metadata (scripts, curl) work: they carry no ambient cookies', async () => {
    expect((await owner.post('/api/projects', { title: 'From a script' })).status).toBe(201)
  })

  it('GET stays open to links from anywhere (Lax cookies are sent on top-level navigation)', async () => {
    const res = await owner.request('GET', '/api/projects', undefined, { origin: 'http://evil.example', 'sec-fetch-site': 'cross-site' })
    expect(res.status).toBe(200)
  })

  it('a body-less POST action needs no content type', async () => {
    const workshop = (await owner.get('/api/session')).body.workshop.id
    const res = await owner.request('POST', `/api/workshops/${workshop}/switch`, undefined, { origin: baseUrl })
    expect(res.status).toBe(200)
  })
})
