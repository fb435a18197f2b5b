// Shapes of the review routes' answers, as the pages read them.
import type { CircuitDiff, CircuitDocument, DiffCounts } from '#shared/circuit'
import type { Report } from '#shared/engine'
import type { KeyedFinding, QuantityChanges } from '#shared/review'
import type { PersonRef, ReviewState, ReviewStatus } from '#shared/schemas/review'

export interface Acknowledgement { id: string; findingKey: string; justification: string; createdAt: string; by: PersonRef | null }

export interface ReviewDetail {
  review: {
    id: string; circuitId: string; version: number; state: ReviewState; submittedAt: string; submitNote: string
    decidedAt: string | null; decisionNote: string; summary: { error: number; warning: number; note: number }
    submitter: PersonRef | null; decider: PersonRef | null
  }
  circuit: { id: string; title: string; kind: 'coolant' | 'fuel'; projectId: string; currentVersion: number }
  project: { id: string; title: string }
  document: CircuitDocument
  report: Report
  findings: Array<KeyedFinding & { acknowledgement: Acknowledgement | null }>
  acknowledgements: Acknowledgement[]
  blockers: { errors: string[]; unacknowledged: string[] }
  canApprove: boolean
  viewer: { mayDecide: boolean; refusal: string | null }
  reviewStatus: ReviewStatus
}

export interface ReviewListItem {
  id: string; version: number; state: ReviewState; submittedAt: string; decidedAt: string | null
  submitNote: string; decisionNote: string; submitter: PersonRef | null; decider: PersonRef | null
  summary: { error: number; warning: number; note: number }
}

export interface DiffAnswer {
  from: { version: number; savedAt: string; savedBy: string | null }
  to: { version: number; savedAt: string; savedBy: string | null }
  diff: CircuitDiff
  counts: DiffCounts
  quantities: QuantityChanges
}
