// Small wording helpers shared by the procedure generators.
import type { Report } from '../engine'
import { num } from './format'
import type { ProcedurePhase, ProcedureStep, StepKind } from './procedureTypes'

export const RULE_OF_THUMB = '(rule of thumb)'

export function step(phase: ProcedurePhase, kind: StepKind, id: string, text: string, elementIds: string[] = [], ruleOfThumb = false): ProcedureStep {
  const s: ProcedureStep = { id: `${phase}/${id}`, phase, kind, text: ruleOfThumb ? `${text} ${RULE_OF_THUMB}` : text, elementIds }
  if (ruleOfThumb) s.ruleOfThumb = true
  return s
}

export const heightText = (zMm: number): string =>
  zMm >= 0 ? `${num(zMm, 0)} mm above the datum` : `${num(-zMm, 0)} mm below the datum`

/** Hose tags in the report's order (H1, H2 …), whatever order the ids come in. */
export function tagsOf(report: Report, hoseIds: readonly string[]): string[] {
  const wanted = new Set(hoseIds)
  const known = report.quantities.hoses.filter((h) => wanted.has(h.hoseId))
  const unknown = hoseIds.filter((id) => !known.some((h) => h.hoseId === id))
  return [...known.map((h) => h.tag), ...unknown]
}

/**
 * Two findings on one element (two high points along one hose) would give two steps one id: the
 * second becomes "…-2", the third "…-3", in the report's stable order.
 */
export function uniqueIds(steps: ProcedureStep[]): ProcedureStep[] {
  const taken = new Set<string>()
  return steps.map((s) => {
    let id = s.id
    for (let n = 2; taken.has(id); n++) id = `${s.id}-${n}`
    taken.add(id)
    return id === s.id ? s : { ...s, id }
  })
}

/** "A", "A and B", "A, B and C" */
export function listText(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? ''
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
}
