// "@name" in a comment, resolved against the workshop's members. Names may hold spaces, so at each
// "@" the longest member name (or e-mail local part) that follows wins, case-insensitively, and it
// must end at a word boundary: "@Ada" does not pick "Adam".
export interface Mentionable {
  id: string
  name: string
  email: string
}

const WORD = /[\p{L}\p{N}_]/u

function startsAt(text: string, at: number, candidate: string): boolean {
  if (candidate.length === 0) return false
  if (text.slice(at, at + candidate.length).toLocaleLowerCase() !== candidate.toLocaleLowerCase()) return false
  const next = text[at + candidate.length]
  return next === undefined || !WORD.test(next)
}

/** Member ids mentioned in `body`, in order of first mention, each once. */
export function resolveMentions(body: string, members: readonly Mentionable[]): string[] {
  const found: string[] = []
  for (let i = 0; i < body.length; i++) {
    if (body[i] !== '@') continue
    const before = body[i - 1]
    if (before !== undefined && (WORD.test(before) || before === '.')) continue // an e-mail address, not a mention
    let best: { id: string; length: number } | null = null
    for (const m of members) {
      for (const candidate of [m.name.trim(), m.email.split('@')[0] ?? '']) {
        if (startsAt(body, i + 1, candidate) && (!best || candidate.length > best.length)) best = { id: m.id, length: candidate.length }
      }
    }
    if (best && !found.includes(best.id)) found.push(best.id)
  }
  return found
}

/** The partial name being typed right before `caret` ("@fab" → "fab"), or null when not in a mention. */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const upto = text.slice(0, caret)
  const at = upto.lastIndexOf('@')
  if (at < 0) return null
  const before = upto[at - 1]
  if (before !== undefined && (WORD.test(before) || before === '.')) return null
  const query = upto.slice(at + 1)
  if (query.length > 40 || /[\n@]/.test(query) || /\s\s/.test(query)) return null
  return { start: at, query }
}

/** Members whose name or e-mail starts with the query (any word of the name), best first. */
export function mentionSuggestions(query: string, members: readonly Mentionable[], limit = 6): Mentionable[] {
  const q = query.trim().toLocaleLowerCase()
  const score = (m: Mentionable) => {
    const name = m.name.toLocaleLowerCase()
    if (name.startsWith(q)) return 0
    if (name.split(/\s+/).some((w) => w.startsWith(q))) return 1
    if (m.email.toLocaleLowerCase().startsWith(q)) return 2
    return -1
  }
  return members.map((m) => ({ m, s: score(m) })).filter((x) => x.s >= 0)
    .sort((a, b) => a.s - b.s || a.m.name.localeCompare(b.m.name)).slice(0, limit).map((x) => x.m)
}
