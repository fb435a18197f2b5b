import { createHash, randomBytes } from 'node:crypto'
import { z } from 'zod'

// Links in e-mails carry a random token; only its SHA-256 is stored, so a copy of the database
// does not hand out working invitation or reset links.

/** 32 random bytes, base64url (43 characters), and the hash to store. */
export function createLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, tokenHash: hashLinkToken(token) }
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex')
}

/** Route parameter `token`: anything that is not the shape of one of ours can match nothing (404). */
export const tokenParam = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{43}$/) })

/** Whole positive number from the environment, or the default. */
export function envNumber(name: string, fallback: number): number {
  const value = Number(process.env[name])
  return Number.isFinite(value) && value > 0 ? value : fallback
}
