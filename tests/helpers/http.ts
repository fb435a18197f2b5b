// A tiny HTTP client for the API suites: keeps cookies like a browser and never throws on status.
import { linkFrom, tokenOf, waitForMail } from './mail'

export const baseUrl = (() => {
  const url = process.env.HOSEWRIGHT_TEST_URL
  if (!url) throw new Error('HOSEWRIGHT_TEST_URL is not set: run the suites through `npm test`')
  return url.replace(/\/$/, '')
})()

export interface Reply<T = any> { status: number; body: T; headers: Headers }

export class Client {
  cookies = new Map<string, string>()
  constructor(public forwardedFor?: string) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const h: Record<string, string> = { accept: 'application/json', ...headers }
    if (body !== undefined && typeof body !== 'string') h['content-type'] = 'application/json'
    if (this.cookies.size) h.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    if (this.forwardedFor) h['x-forwarded-for'] = this.forwardedFor
    const res = await fetch(baseUrl + path, {
      method, headers: h, redirect: 'manual',
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    })
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';')
      const eq = pair!.indexOf('=')
      const name = pair!.slice(0, eq).trim()
      const value = pair!.slice(eq + 1).trim()
      if (!value || /max-age=0|expires=thu, 01 jan 1970/i.test(c)) this.cookies.delete(name)
      else this.cookies.set(name, value)
    }
    const text = await res.text()
    let parsed: unknown = text
    try { parsed = text ? JSON.parse(text) : null } catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body ?? {}) }
  put<T = any>(path: string, body?: unknown) { return this.request<T>('PUT', path, body ?? {}) }
  delete<T = any>(path: string, body?: unknown) { return this.request<T>('DELETE', path, body) }
}

let counter = 0
/** A unique address per call, so suites never collide with each other or with the demo data. */
export function uniqueEmail(tag: string) {
  return `${tag}-${Date.now().toString(36)}-${(counter++).toString(36)}-${Math.random().toString(36).slice(2, 6)}@example.test`
}

export const goodPassword = 'plenty-long-password-9'

/** Signs up a new workshop owner; returns the signed-in client and the session summary. */
export async function signUp(tag = 'owner', workshopName = `Test shop ${tag}`) {
  const client = new Client(`10.${counter % 250}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`)
  const email = uniqueEmail(tag)
  const res = await client.post('/api/account', { name: `Test ${tag}`, email, password: goodPassword, workshopName })
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`)
  return { client, email, summary: res.body }
}

/** Invites someone into the owner's workshop, follows the link from the e-mail that arrived and
 *  accepts with a new account; returns a client signed in as them. */
export async function addMember(owner: Client, role: string, tag = role) {
  const email = uniqueEmail(tag)
  const invited = await owner.post('/api/members', { email, role, name: `Test ${tag}` })
  if (invited.status !== 201) throw new Error(`inviting failed: ${invited.status} ${JSON.stringify(invited.body)}`)
  const mail = await waitForMail(email, { subject: 'Join ' })
  const token = tokenOf(linkFrom(mail, '/invite/'))
  const client = new Client(owner.forwardedFor)
  const accepted = await client.post(`/api/invitations/token/${token}/accept`, { name: `Test ${tag}`, password: goodPassword })
  if (accepted.status !== 200) throw new Error(`accepting the invitation failed: ${accepted.status} ${JSON.stringify(accepted.body)}`)
  return { client, email, password: goodPassword, membershipId: accepted.body.membershipId as string, invitationId: invited.body.id as string }
}
