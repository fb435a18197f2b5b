// The environment the server reads, checked once at start (server/plugins/0.config.ts): a wrong
// value stops the process with one line per bad variable instead of failing later on first use.
// Values are never echoed back: several of them are secrets.
import { z } from 'zod'

const flag = z.enum(['0', '1', 'true', 'false', 'yes', 'no'], { message: 'use 1 or 0' })
const port = z.coerce.number({ message: 'a port number' }).int('a whole port number').min(1, 'a port from 1 to 65535').max(65535, 'a port from 1 to 65535')
const positive = (what: string) => z.coerce.number({ message: `a number of ${what}` }).positive(`more than 0 ${what}`)
const whole = (what: string) => positive(what).int(`a whole number of ${what}`)
const httpUrl = z.url({ protocol: /^https?$/, message: 'an http:// or https:// address' })
const msList = z.string().regex(/^\s*\d+(\s*,\s*\d+)*\s*$/, 'milliseconds separated by commas, e.g. 5000,30000')

export const configSchema = z.object({
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/, message: 'a postgres:// or postgresql:// address' }),
  DATABASE_POOL_SIZE: whole('connections').max(200, 'at most 200 connections').optional(),
  NUXT_SESSION_PASSWORD: z.string({ message: 'a secret of at least 32 characters that seals session cookies' })
    .min(32, 'at least 32 characters'),
  HOSEWRIGHT_APP_URL: httpUrl.optional(),
  HOSEWRIGHT_SESSION_HOURS: positive('hours').optional(),
  HOSEWRIGHT_SIGNIN_MAX_PER_EMAIL: whole('attempts').optional(),
  HOSEWRIGHT_SIGNIN_MAX_PER_IP: whole('attempts').optional(),
  HOSEWRIGHT_SIGNIN_WINDOW_MINUTES: positive('minutes').optional(),
  HOSEWRIGHT_RESET_MINUTES: positive('minutes').optional(),
  HOSEWRIGHT_RESET_MAX_PER_EMAIL: whole('requests').optional(),
  HOSEWRIGHT_RESET_MAX_PER_IP: whole('requests').optional(),
  HOSEWRIGHT_RESET_WINDOW_MINUTES: positive('minutes').optional(),
  HOSEWRIGHT_INVITE_DAYS: positive('days').optional(),
  HOSEWRIGHT_PHOTO_MAX_MB: positive('megabytes').max(100, 'at most 100 MB').optional(),
  HOSEWRIGHT_JSON_MAX_MB: positive('megabytes').max(200, 'at most 200 MB').optional(),
  HOSEWRIGHT_UPLOAD_MAX_MB: positive('megabytes').max(200, 'at most 200 MB').optional(),
  HOSEWRIGHT_MAIL_POLL_MS: whole('milliseconds').optional(),
  HOSEWRIGHT_MAIL_RETRY_MS: msList.optional(),
  HOSEWRIGHT_MAIL_MAX_ATTEMPTS: whole('attempts').optional(),
  HOSEWRIGHT_MAIL_LEASE_MS: whole('milliseconds').optional(),
  HOSEWRIGHT_HSTS_MAX_AGE: z.coerce.number({ message: 'a number of seconds' }).int('a whole number of seconds').min(0, '0 (off) or more seconds').optional(),
  NITRO_SHUTDOWN_TIMEOUT: whole('milliseconds').optional(),
  HOSEWRIGHT_SEED_DEMO: flag.optional(),
  HOSEWRIGHT_TRUST_PROXY: flag.optional(),
  HOSEWRIGHT_MAIL_WORKER: flag.optional(),
  HOSEWRIGHT_MAIL_OUTBOX_PAGE: flag.optional(),
  HOSEWRIGHT_SKIP_MIGRATE: flag.optional(),
  SMTP_HOST: z.string().regex(/^[A-Za-z0-9.:[\]-]+$/, 'a host name or address').optional(),
  SMTP_PORT: port.optional(),
  SMTP_SECURE: flag.optional(),
  SMTP_IGNORE_TLS: flag.optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().min(3, 'a sender such as "Hosewright <hosewright@example.test>"').optional(),
  S3_ENDPOINT: httpUrl.optional(),
  S3_REGION: z.string().regex(/^[a-z0-9-]+$/, 'a region name such as us-east-1').optional(),
  S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, '3–63 lower-case letters, digits, dots or hyphens').optional(),
  S3_FORCE_PATH_STYLE: flag.optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
})

/** Settings that only make sense together; checked even when single values are wrong too. */
function pairProblems(env: Record<string, string>): ConfigProblem[] {
  const problems: ConfigProblem[] = []
  // one key without the other would silently fall back to the SDK's own credential chain
  if (Boolean(env.S3_ACCESS_KEY_ID) !== Boolean(env.S3_SECRET_ACCESS_KEY)) {
    problems.push({ variable: env.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID', message: 'set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither' })
  }
  if (env.SMTP_PASS && !env.SMTP_USER) problems.push({ variable: 'SMTP_USER', message: 'SMTP_PASS is set without SMTP_USER' })
  return problems
}

export type AppConfig = z.output<typeof configSchema>

export interface ConfigProblem { variable: string; message: string }

/** Empty strings count as unset, as the shell scripts export them that way. */
function presentOnly(env: NodeJS.ProcessEnv): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [key, value] of Object.entries(env)) if (value !== undefined && value !== '') out[key] = value
  // the database address may also come from Nuxt's runtime config variable
  if (!out.DATABASE_URL && out.NUXT_DATABASE_URL) out.DATABASE_URL = out.NUXT_DATABASE_URL
  return out
}

export function checkConfig(env: NodeJS.ProcessEnv = process.env): { ok: true; config: AppConfig } | { ok: false; problems: ConfigProblem[] } {
  const present = presentOnly(env)
  const parsed = configSchema.safeParse(present)
  const problems = (parsed.success ? [] : parsed.error.issues).map((issue) => {
    const variable = String(issue.path[0] ?? '(environment)')
    return { variable, message: variable in present ? issue.message : `required (${issue.message})` }
  })
  problems.push(...pairProblems(present))
  if (parsed.success && problems.length === 0) return { ok: true, config: parsed.data }
  return { ok: false, problems }
}

/** The start-up message: every bad variable on its own line, values left out. */
export function describeConfigProblems(problems: ConfigProblem[]): string {
  const lines = problems.map(p => `  - ${p.variable}: ${p.message}`)
  return [`Hosewright cannot start: ${problems.length} setting${problems.length === 1 ? ' is' : 's are'} wrong.`, ...lines,
    'See "Configuration" in README.md.'].join('\n')
}

let current: AppConfig | undefined

/** The checked configuration (checked on first use when the start-up plugin has not run, e.g. in scripts). */
export function appConfig(): AppConfig {
  if (!current) {
    const result = checkConfig()
    if (!result.ok) throw new Error(describeConfigProblems(result.problems))
    current = result.config
  }
  return current
}

export const isFlagOn = (value: string | undefined) => value === '1' || value === 'true' || value === 'yes'

const MB = 1024 * 1024

/**
 * Largest accepted request bodies: JSON (big circuit saves) and multipart (photo uploads; always
 * room for the photo limit plus the form around it, so the photo route can say what is too big).
 */
export function bodyLimits(config: AppConfig = appConfig()) {
  const photoMb = config.HOSEWRIGHT_PHOTO_MAX_MB ?? 10
  return {
    jsonBytes: Math.round((config.HOSEWRIGHT_JSON_MAX_MB ?? 20) * MB),
    multipartBytes: Math.round(Math.max(config.HOSEWRIGHT_UPLOAD_MAX_MB ?? 12, photoMb + 1) * MB),
  }
}
