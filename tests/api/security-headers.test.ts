import { afterAll, describe, expect, it } from 'vitest'
import { baseUrl, Client, goodPassword, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Response headers and body limits as a browser or an attacker meets them. Sources beside each
// check; "from memory" where the document was not at hand.
afterAll(() => sql.end())

function cspOf(header: string | null): Map<string, string[]> {
  const directives = new Map<string, string[]>()
  for (const part of (header ?? '').split(';').map(p => p.trim()).filter(Boolean)) {
    const [name, ...sources] = part.split(/\s+/)
    directives.set(name!, sources)
  }
  return directives
}

describe('security headers on pages', () => {
  it('a content security policy without unsafe-eval or inline scripts, with a fresh nonce per page', async () => {
    const [a, b] = await Promise.all([fetch(`${baseUrl}/sign-in`), fetch(`${baseUrl}/sign-in`)])
    const csp = cspOf(a.headers.get('content-security-policy'))
    // CSP Level 3 (W3C): frame-ancestors, object-src, base-uri are not covered by default-src
    expect(csp.get('frame-ancestors')).toEqual(["'none'"])
    expect(csp.get('object-src')).toEqual(["'none'"])
    expect(csp.get('base-uri')).toEqual(["'self'"])
    expect(csp.get('connect-src')).toEqual(["'self'"])
    expect(csp.get('worker-src')).toEqual(["'self'"])
    expect(csp.get('img-src')).toEqual(["'self'", 'blob:', 'data:'])
    expect(csp.get('script-src-attr')).toEqual(["'none'"])
    const scripts = csp.get('script-src')!
    expect(scripts).not.toContain("'unsafe-eval'")
    expect(scripts).not.toContain("'unsafe-inline'")
    const nonce = scripts.find(s => s.startsWith("'nonce-"))!.slice(7, -1)
    expect(nonce.length).toBeGreaterThanOrEqual(16)
    const html = await a.text()
    // every script tag of the page carries that nonce, the inline payload and config included
    const tags = html.match(/<script\b[^>]*>/g) ?? []
    expect(tags.length).toBeGreaterThan(1)
    for (const tag of tags) expect(tag).toContain(`nonce="${nonce}"`)
    const other = cspOf(b.headers.get('content-security-policy')).get('script-src')!.find(s => s.startsWith("'nonce-"))
    expect(other).not.toBe(`'nonce-${nonce}'`)
  })

  it('isolation, referrer, permissions and sniffing headers', async () => {
    const res = await fetch(`${baseUrl}/sign-in`)
    // OWASP HTTP Headers Cheat Sheet (from memory) for each of these values
    expect(res.headers.get('cross-origin-opener-policy')).toBe('same-origin')
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
    // same-origin, not no-referrer: the Fetch standard sends `Origin: null` on same-origin POSTs under no-referrer
    expect(res.headers.get('referrer-policy')).toBe('same-origin')
    const permissions = res.headers.get('permissions-policy')!
    for (const feature of ['camera', 'microphone', 'geolocation']) expect(permissions).toContain(`${feature}=()`)
    expect(res.headers.get('x-powered-by')).toBeNull()
  })

  it('API answers and static files are not sniffed or framed either', async () => {
    const api = await fetch(`${baseUrl}/api/health`)
    expect(api.headers.get('x-content-type-options')).toBe('nosniff')
    expect(api.headers.get('x-frame-options')).toBe('DENY')
    const icon = await fetch(`${baseUrl}/favicon.svg`)
    expect(icon.headers.get('x-content-type-options')).toBe('nosniff')
  })

  it('HSTS only when the answer went out over https (here: a trusted proxy says so)', async () => {
    // RFC 6797 §7.2 (from memory): a host must not send Strict-Transport-Security over plain http
    expect((await fetch(`${baseUrl}/sign-in`)).headers.get('strict-transport-security')).toBeNull()
    const viaHttps = await fetch(`${baseUrl}/sign-in`, { headers: { 'x-forwarded-proto': 'https' } })
    expect(viaHttps.headers.get('strict-transport-security')).toMatch(/^max-age=\d{7,}; includeSubDomains$/)
  })
})

describe('the session cookie', () => {
  it('is HttpOnly, Secure, SameSite=Lax, for the whole site, and ends with the session', async () => {
    const { email } = await signUp('cookie-flags')
    const res = await new Client().post('/api/session', { email, password: goodPassword })
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('nuxt-session='))!
    // RFC 6265bis: HttpOnly keeps scripts out, Secure keeps it off plain http, SameSite=Lax off cross-site POSTs
    expect(cookie).toMatch(/;\s*HttpOnly/i)
    expect(cookie).toMatch(/;\s*Secure/i)
    expect(cookie).toMatch(/;\s*SameSite=Lax/i)
    expect(cookie).toMatch(/;\s*Path=\//i)
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)![1]!)
    // runtimeConfig.session.maxAge in nuxt.config.ts: 12 hours, like the server-side session row
    expect(Math.abs(expires - Date.now() - 12 * 3600_000)).toBeLessThan(120_000)
  })
})

describe('request body limits', () => {
  const mb = 1024 * 1024
  it('a JSON body over 20 MB answers 413 before it is read, whatever the method', async () => {
    const { client } = await signUp('big-body')
    const huge = JSON.stringify({ title: 'x'.repeat(20 * mb + 10) })
    for (const method of ['POST', 'PUT', 'PATCH']) {
      const res = await client.request(method, '/api/projects', huge, { 'content-type': 'application/json' })
      expect(res.status, method).toBe(413)
      expect(res.body.message).toMatch(/larger than 20 MB/)
    }
  })

  it('a chunked JSON body (no length given) is counted as it arrives: 413 too', async () => {
    const { client } = await signUp('chunked-body')
    const piece = new TextEncoder().encode('x'.repeat(mb))
    let sent = 0
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent === 0) controller.enqueue(new TextEncoder().encode('{"title":"'))
        if (sent++ < 22) controller.enqueue(piece)
        else { controller.enqueue(new TextEncoder().encode('"}')); controller.close() }
      },
    })
    const res = await fetch(`${baseUrl}/api/projects`, {
      method: 'POST', body: stream, duplex: 'half',
      headers: { 'content-type': 'application/json', cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    } as RequestInit)
    expect(res.status).toBe(413)
  })

  it('a big body under the limit reaches validation (400 with fields), not a size refusal', async () => {
    const { client } = await signUp('large-ok')
    const res = await client.post('/api/projects', { title: 'Large notes', notes: 'n'.repeat(15 * mb) })
    expect(res.status).toBe(400)
    expect(res.body.data.fields.notes).toMatch(/at most 8000/)
  })

  it('a multipart upload over 12 MB answers 413 (the photo route answers its own 413 below that)', async () => {
    const { client } = await signUp('big-upload')
    const projectId = (await client.post('/api/projects', { title: 'Uploads' })).body.id
    const circuitId = (await client.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'C' })).body.id
    const form = new FormData()
    form.append('componentId', 'radiator')
    form.append('file', new Blob([new Uint8Array(13 * mb)], { type: 'image/png' }), 'huge.png')
    const res = await fetch(`${baseUrl}/api/circuits/${circuitId}/photos`, {
      method: 'POST', body: form, headers: { accept: 'application/json', cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    })
    expect(res.status).toBe(413)
    expect((await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`)[0]!.n).toBe(0)
  })
})
