// Structured logs: one JSON object per line on stdout, so a log collector can read every line the
// server writes. Request lines come from server/plugins/requestLog.ts; console output of the app and
// its libraries is turned into the same shape by captureConsole(). Bodies, headers and cookies are
// never logged; link tokens in paths and secret-looking query values are masked.
import { format } from 'node:util'

export type LogLevel = 'debug' | 'info' | 'warn' | 'error' | 'fatal'
export type LogFields = Record<string, unknown>

const write = (line: string) => process.stdout.write(`${line}\n`)

export function writeLog(level: LogLevel, msg: string, fields: LogFields = {}) {
  write(JSON.stringify({ time: new Date().toISOString(), level, msg: redactText(msg), ...fields }))
}

// invitation and reset links carry 43-character base64url tokens (server/utils/tokens.ts)
const TOKEN_SEGMENT = /^[A-Za-z0-9_-]{43}$/
const TOKEN_AFTER = /^(invite|reset-password|token|password-resets)$/
const TOKEN_IN_TEXT = /(?<![A-Za-z0-9_-])[A-Za-z0-9_-]{43}(?![A-Za-z0-9_-])/g
const SECRET_NAME = /token|password|passwd|secret|key|code|sig|auth|session/i

/** The path of a request URL with link tokens masked and secret-looking query values removed. */
export function redactPath(url: string): string {
  const [rawPath = '', query] = url.split('?', 2)
  const segments = rawPath.split('/')
  const path = segments.map((s, i) => (TOKEN_SEGMENT.test(s) || (i > 0 && TOKEN_AFTER.test(segments[i - 1]!) && s !== '') ? ':token' : s)).join('/')
  if (!query) return path
  const params = new URLSearchParams(query)
  const kept = [...params.keys()].map(k => `${encodeURIComponent(k)}=${SECRET_NAME.test(k) ? '[redacted]' : encodeURIComponent(params.get(k) ?? '')}`)
  return `${path}?${kept.join('&')}`
}

/** Free text with anything shaped like a link token, and `password=…`-style pairs, masked. */
export function redactText(text: string): string {
  return text.replace(TOKEN_IN_TEXT, ':token').replace(/\b(password|passwd|secret|token)(["']?\s*[:=]\s*["']?)[^\s"'&,;]+/gi, '$1$2[redacted]')
}

/** What an error is, for a log line: its kind, message, status and stack (never its data). */
export function errorFields(error: unknown): LogFields {
  if (!(error instanceof Error)) return { error: { message: redactText(String(error)) } }
  const statusCode = (error as { statusCode?: number }).statusCode
  const cause = (error as { cause?: unknown }).cause
  return {
    error: {
      name: error.name,
      message: redactText(error.message),
      ...(statusCode ? { statusCode } : {}),
      ...(error.stack ? { stack: redactText(error.stack) } : {}),
      ...(cause instanceof Error ? { cause: redactText(cause.stack ?? cause.message) } : {}),
    },
  }
}

let captured = false

/** Turns console.* of the whole process into JSON lines (levels kept, text redacted). */
export function captureConsole() {
  if (captured) return
  captured = true
  const as = (level: LogLevel) => (...args: unknown[]) => writeLog(level, format(...args))
  console.log = as('info')
  console.info = as('info')
  console.debug = as('debug')
  console.warn = as('warn')
  console.error = as('error')
}
