// Reads what the app really sent: the fake SMTP server's HTTP API (scripts/fake-smtp.mjs).
import { createHash } from 'node:crypto'
import { existsSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { baseUrl } from './http'

export interface ReceivedMail {
  id: string
  receivedAt: string
  envelope: { from: string | null; to: string[] }
  from: string | null
  to: string
  subject: string
  text: string
  html: string
  attachments: Array<{ filename: string; contentType: string; size: number }>
}

let apiUrl: string | undefined

/** Where the fake's HTTP API is: set by scripts/test.sh, or noted by scripts/test-server.sh. */
export function mailApiUrl(): string {
  apiUrl ??= findMailApi()
  return apiUrl
}

// looked up on first use: http.ts and this file import each other
function findMailApi(): string {
  const fromEnv = process.env.HOSEWRIGHT_TEST_MAIL_URL
  if (fromEnv) return fromEnv.replace(/\/$/, '')
  const root = fileURLToPath(new URL('../..', import.meta.url)).replace(/\/$/, '')
  const port = new URL(baseUrl).port
  const stateDirs = [process.env.HOSEWRIGHT_STATE_DIR, `${root}/.data`,
    `/var/tmp/hosewright-${createHash('sha1').update(root).digest('hex').slice(0, 12)}`].filter(Boolean) as string[]
  const note = stateDirs.map(d => `${d}/test-server-${port}.mail`).find(f => existsSync(f))
  if (!note) throw new Error('HOSEWRIGHT_TEST_MAIL_URL is not set and scripts/test-server.sh left no note: run the suites through npm test')
  const line = readFileSync(note, 'utf8').split('\n').find(l => l.startsWith('HOSEWRIGHT_TEST_MAIL_URL='))!
  return line.slice('HOSEWRIGHT_TEST_MAIL_URL='.length).trim()
}

/** Every message the fake received for this address, oldest first. */
export async function mailTo(to: string): Promise<ReceivedMail[]> {
  const res = await fetch(`${mailApiUrl()}/messages?to=${encodeURIComponent(to)}`)
  if (!res.ok) throw new Error(`fake SMTP answered ${res.status}`)
  return await res.json() as ReceivedMail[]
}

/**
 * Waits for a message to `to` (optionally with a subject containing `subject`) and returns the
 * newest match. `after` skips messages already seen (pass how many there were before the action).
 */
export async function waitForMail(to: string, options: { subject?: string; timeoutMs?: number; after?: number } = {}): Promise<ReceivedMail> {
  const deadline = Date.now() + (options.timeoutMs ?? 10_000)
  for (;;) {
    const all = await mailTo(to)
    const fresh = all.slice(options.after ?? 0).filter(m => !options.subject || m.subject.includes(options.subject))
    if (fresh.length) return fresh[fresh.length - 1]!
    if (Date.now() > deadline) throw new Error(`no mail to ${to}${options.subject ? ` about "${options.subject}"` : ''} within ${options.timeoutMs ?? 10_000} ms (${all.length} other)`)
    await new Promise(resolve => setTimeout(resolve, 100))
  }
}

/** The first link in the message's text whose path starts with `pathPrefix`, as a URL. */
export function linkFrom(mail: Pick<ReceivedMail, 'text'>, pathPrefix: string): URL {
  for (const match of mail.text.matchAll(/https?:\/\/[^\s<>"')]+/g)) {
    const url = new URL(match[0])
    if (url.pathname.startsWith(pathPrefix)) return url
  }
  throw new Error(`no ${pathPrefix}… link in the mail:\n${mail.text}`)
}

/** The last path segment of a link: the token of an invitation or reset link. */
export function tokenOf(link: URL): string {
  return link.pathname.split('/').filter(Boolean).pop()!
}

/** Makes the fake answer the next `count` deliveries with a temporary failure (451); 0 ends that. */
export async function failNextDeliveries(count: number) {
  const res = await fetch(`${mailApiUrl()}/fail?count=${count}`, { method: 'POST' })
  if (!res.ok) throw new Error(`fake SMTP answered ${res.status}`)
}
