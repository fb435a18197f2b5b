// Short, readable element ids ("hose-7", "radiator-2", "radiator-2-inlet") for parts, ports and hoses
// drawn in the editor. Ids are unique across all three kinds (see crossReferences.ts).
import type { CircuitDocument } from './document'
import { ID_MAX_LENGTH } from './primitives'

/** Every id in use: parts, their ports and hoses. */
export function documentIds(doc: CircuitDocument): Set<string> {
  const ids = new Set<string>()
  for (const c of doc.circuit.components) {
    ids.add(c.id)
    for (const p of c.ports) ids.add(p.id)
  }
  for (const h of doc.circuit.hoses) ids.add(h.id)
  return ids
}

/** Turns any text into the id alphabet (letters, digits, . _ : -), lower case, no doubled dashes. */
export function idSlug(text: string, fallback = 'item'): string {
  const slug = text
    .normalize('NFKD')
    .toLowerCase()
    .replace(/[^a-z0-9._:-]+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^-+|-+$/g, '')
  return slug === '' ? fallback : slug
}

/**
 * The next free id for a prefix: `${prefix}-${n}` with n one above the highest number already used
 * with that prefix, so an id freed by a delete is not handed to a different element straight away
 * (a reviewer comparing two versions by id would otherwise mistake one for the other).
 * `existing` is updated with the new id, so a loop can call this repeatedly.
 */
export function newId(prefix: string, existing: Set<string>): string {
  const base = idSlug(prefix).slice(0, ID_MAX_LENGTH - 8)
  let highest = 0
  const pattern = `${base}-`
  for (const id of existing) {
    if (!id.startsWith(pattern)) continue
    const rest = id.slice(pattern.length)
    if (/^\d{1,7}$/.test(rest)) highest = Math.max(highest, Number(rest))
  }
  let n = highest + 1
  let id = `${base}-${n}`
  while (existing.has(id)) id = `${base}-${++n}`
  existing.add(id)
  return id
}

/**
 * An id made of an owner id and a local name ("radiator-2" + "inlet" → "radiator-2-inlet"), kept
 * within the length limit and made unique with a number when taken. `existing` is updated.
 */
export function childId(ownerId: string, local: string, existing: Set<string>): string {
  const tail = idSlug(local, 'port').slice(0, 24)
  const head = ownerId.slice(0, ID_MAX_LENGTH - tail.length - 1)
  let id = `${head}-${tail}`
  if (existing.has(id)) id = newId(id.slice(0, ID_MAX_LENGTH - 8), existing)
  existing.add(id)
  return id
}
