// Who may sign a review off, and what stands in the way. The server enforces both; the review page
// uses the same functions to explain a disabled button.
import { can } from '../permissions'
import type { Role } from '../schemas/membership'
import type { KeyedFinding } from './findingKeys'

/** A warning's sign-off needs a reason a colleague can read later, not "ok". */
export const MIN_JUSTIFICATION_LENGTH = 10

export interface ApprovalBlockers {
  /** error findings: nobody can approve a version that has any */
  errors: KeyedFinding[]
  /** warnings nobody has acknowledged yet */
  unacknowledged: KeyedFinding[]
}

export function approvalBlockers(findings: readonly KeyedFinding[], acknowledgedKeys: Iterable<string>): ApprovalBlockers {
  const acked = new Set(acknowledgedKeys)
  return {
    errors: findings.filter((f) => f.severity === 'error'),
    unacknowledged: findings.filter((f) => f.severity === 'warning' && !acked.has(f.key)),
  }
}

export function canApprove(blockers: ApprovalBlockers): boolean {
  return blockers.errors.length === 0 && blockers.unacknowledged.length === 0
}

export interface DecisionContext {
  role: Role
  /** the person deciding is the one who put this version up for review */
  isSubmitter: boolean
  /** workshop setting: a fabricator may approve their own submission */
  fabricatorMayApproveOwn: boolean
}

export type DecisionRefusal = 'role' | 'own-submission'

/**
 * Reviewers and owners decide reviews (approve, request changes, acknowledge warnings). Nobody
 * decides a submission of their own (an owner neither) unless the workshop allows it, and then a
 * fabricator may decide their own too. Technicians never decide.
 */
export function decisionRefusal(ctx: DecisionContext): DecisionRefusal | null {
  if (ctx.isSubmitter) {
    if (!ctx.fabricatorMayApproveOwn) return 'own-submission'
    return can(ctx.role, 'review:decide') || ctx.role === 'fabricator' ? null : 'role'
  }
  return can(ctx.role, 'review:decide') ? null : 'role'
}

export const decisionRefusalText: Record<DecisionRefusal, string> = {
  role: 'Only reviewers and owners sign reviews off.',
  'own-submission': 'You submitted this version yourself: someone else signs it off (an owner can allow fabricators to approve their own work in the workshop settings).',
}
