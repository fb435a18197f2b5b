// A cookie-keeping HTTP client bound to one server address (the shared tests/helpers/http.ts is
// bound to the suite's test server; these suites start and kill servers of their own).
export interface Reply<T = any> { status: number; body: T; headers: Headers }

export class AppClient {
  cookies = new Map<string, string>()
  constructor(public base: string) {}

  cookieHeader(): Record<string, string> {
    return this.cookies.size ? { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } : {}
  }

  keepCookies(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair = ''] = c.split(';')
      const at = pair.indexOf('=')
      const value = pair.slice(at + 1).trim()
      if (!value || /max-age=0/i.test(c)) this.cookies.delete(pair.slice(0, at).trim())
      else this.cookies.set(pair.slice(0, at).trim(), value)
    }
  }

  async request<T = any>(method: string, path: string, body?: unknown, init: RequestInit = {}): Promise<Reply<T>> {
    const headers: Record<string, string> = { accept: 'application/json', ...this.cookieHeader() }
    const isForm = body instanceof FormData
    if (body !== undefined && !isForm) headers['content-type'] = 'application/json'
    const res = await fetch(this.base + path, {
      ...init, method, headers, redirect: 'manual',
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    })
    this.keepCookies(res)
    const text = await res.text()
    let parsed: unknown = text
    try { parsed = text ? JSON.parse(text) : null } catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body: unknown = {}) { return this.request<T>('POST', path, body) }
  put<T = any>(path: string, body: unknown = {}) { return this.request<T>('PUT', path, body) }
}

export const password = 'reliability-password-42'

/** A new owner with a workshop, a project and an empty coolant circuit. */
export async function ownerWithCircuit(base: string, tag: string) {
  const client = new AppClient(base)
  const email = `${tag}-${Date.now().toString(36)}@example.test`
  const signedUp = await client.post('/api/account', { name: `Owner ${tag}`, email, password, workshopName: `Workshop ${tag}` })
  if (signedUp.status !== 201) throw new Error(`sign-up failed: ${signedUp.status} ${JSON.stringify(signedUp.body)}`)
  const projectId = (await client.post('/api/projects', { title: `Project ${tag}` })).body.id as string
  const circuitId = (await client.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: `Cooling ${tag}` })).body.id as string
  return { client, email, projectId, circuitId }
}
