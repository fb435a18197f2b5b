// Rounding a liquid up to the containers it is sold in.
import { LITRES_PER_US_GALLON } from '../physics/units'
import { num, volumeText } from './format'
import type { ContainerSize } from './types'

const litre = (n: number): ContainerSize => ({ id: `${n}l`, litres: n, system: 'metric', label: `${n} L`, sizes: volumeText(n) })
const US_GALLON: ContainerSize = {
  id: '1gal', litres: LITRES_PER_US_GALLON, system: 'us', label: '1 US gal',
  sizes: { metric: `${num(LITRES_PER_US_GALLON)} L`, imperial: '1 US gal' },
}

/** Common practice: concentrate comes in 1 L, 4 L and 5 L bottles and 1 US gal jugs. */
export const DEFAULT_CONCENTRATE_CONTAINERS: readonly ContainerSize[] = [litre(1), litre(4), litre(5), US_GALLON]
/** Common practice: distilled water comes in 4 L and 5 L bottles and 1 US gal jugs. */
export const DEFAULT_WATER_CONTAINERS: readonly ContainerSize[] = [litre(4), litre(5), US_GALLON]

export const DEFAULT_TOP_UP_RESERVE_PERCENT = 10

export const CONTAINER_RULE =
  'Containers: the need plus the top-up reserve is covered with the smallest total volume, combining sizes of one ' +
  'system only (litre sizes with litre sizes, US gallons with US gallons); a tie goes to fewer containers, then to ' +
  'the larger sizes; a tie between the systems goes to the one listed first. Above 200 L the bulk is taken in the ' +
  'largest size first.'

export interface ContainerChoice {
  /** containers and counts, largest size first */
  items: Array<{ container: ContainerSize; count: number }>
  totalL: number
  count: number
}

/** Enumeration stays small: beyond this the largest size takes the bulk before the search. */
const SEARCH_LIMIT_L = 200
const EPS = 1e-9

function better(a: ContainerChoice, b: ContainerChoice | null): boolean {
  if (!b) return true
  if (a.totalL < b.totalL - EPS) return true
  if (a.totalL > b.totalL + EPS) return false
  if (a.count !== b.count) return a.count < b.count
  // more of the larger sizes: compare counts size by size, largest first
  for (let i = 0; i < a.items.length; i++) {
    const d = a.items[i]!.count - (b.items[i]?.count ?? 0)
    if (d !== 0) return d > 0
  }
  return false
}

/** Best combination of the given sizes (one system) covering `needL`; null when there are no sizes. */
export function bestCombination(needL: number, sizes: readonly ContainerSize[]): ContainerChoice | null {
  const sorted = [...sizes].filter((s) => s.litres > 0).sort((a, b) => b.litres - a.litres)
  if (sorted.length === 0) return null
  const largest = sorted[0]!
  const bulk = needL > SEARCH_LIMIT_L ? Math.ceil((needL - SEARCH_LIMIT_L) / largest.litres) : 0
  const rest = Math.max(0, needL - bulk * largest.litres)
  let best: ContainerChoice | null = null
  const counts = new Array<number>(sorted.length).fill(0)
  const visit = (i: number, remaining: number) => {
    const size = sorted[i]!
    if (i === sorted.length - 1) {
      counts[i] = remaining > EPS ? Math.ceil(remaining / size.litres - EPS) : 0
      const items = sorted.map((container, k) => ({ container, count: counts[k]! + (k === 0 ? bulk : 0) }))
      const totalL = items.reduce((s, it) => s + it.count * it.container.litres, 0)
      const choice = { items, totalL, count: items.reduce((s, it) => s + it.count, 0) }
      if (better(choice, best)) best = choice
      return
    }
    const max = remaining > EPS ? Math.ceil(remaining / size.litres - EPS) : 0
    for (let c = 0; c <= max; c++) {
      counts[i] = c
      visit(i + 1, remaining - c * size.litres)
    }
  }
  visit(0, rest)
  const chosen = best as ContainerChoice | null
  return chosen ? { ...chosen, items: chosen.items.filter((it) => it.count > 0) } : null
}

/**
 * The containers to buy for `needL` (already including any reserve): the best combination in each
 * system, the best of those first. `alternatives` are the other systems' best, for the notes.
 */
export function chooseContainers(needL: number, sizes: readonly ContainerSize[]): { choice: ContainerChoice | null; alternatives: ContainerChoice[] } {
  const systems = [...new Set(sizes.map((s) => s.system))]
  const perSystem = systems
    .map((system) => bestCombination(needL, sizes.filter((s) => s.system === system)))
    .filter((c): c is ContainerChoice => c !== null)
  let choice: ContainerChoice | null = null
  for (const c of perSystem) {
    if (!choice || c.totalL < choice.totalL - EPS || (Math.abs(c.totalL - choice.totalL) <= EPS && c.count < choice.count)) choice = c
  }
  return { choice, alternatives: perSystem.filter((c) => c !== choice) }
}

/** "2 × 5 L", "1 × 5 L + 1 × 4 L", "3 × 1 US gal" */
export function describeChoice(c: ContainerChoice): string {
  return c.items.map((it) => `${it.count} × ${it.container.label}`).join(' + ')
}
