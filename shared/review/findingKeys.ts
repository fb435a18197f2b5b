// A finding's identity across analyses of one frozen document: its code and the ids it names, sorted.
// Codes are kebab-case and ids use letters, digits and . _ : - only, so "|" and "," cannot occur in
// either and the key reads back unambiguously.
import type { Finding, Report, Severity } from '../engine/report'

export function findingKey(finding: Pick<Finding, 'code' | 'elementIds'>): string {
  return `${finding.code}|${[...new Set(finding.elementIds)].sort().join(',')}`
}

export interface KeyedFinding extends Finding {
  key: string
}

/** The report's findings with their keys; a key that occurs twice (the same fault seen twice) is kept once. */
export function keyedFindings(report: Pick<Report, 'findings'>): KeyedFinding[] {
  const seen = new Set<string>()
  const out: KeyedFinding[] = []
  for (const f of report.findings) {
    const key = findingKey(f)
    if (seen.has(key)) continue
    seen.add(key)
    out.push({ ...f, key })
  }
  return out
}

export function findingsOfSeverity(findings: readonly KeyedFinding[], severity: Severity): KeyedFinding[] {
  return findings.filter((f) => f.severity === severity)
}
