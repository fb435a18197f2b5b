import { describe, expect, it } from 'vitest'
import type { Finding } from '#shared/engine'
import { approvalBlockers, canApprove, decisionRefusal, keyedFindings } from '#shared/review'
import { roles } from '#shared/schemas/membership'

const f = (code: string, severity: Finding['severity'], ids: string[]): Finding => ({ code, severity, message: code, elementIds: ids, fix: { text: '' } })

describe('what blocks approval', () => {
  const findings = keyedFindings({ findings: [f('open-port', 'error', ['p1']), f('air-trap', 'warning', ['h1']), f('low-flow', 'warning', ['h2']), f('flow-default-resistance', 'note', ['e'])] })

  it('an error always blocks, whatever is signed off', () => {
    const b = approvalBlockers(findings, findings.map((x) => x.key))
    expect(b.errors.map((x) => x.code)).toEqual(['open-port'])
    expect(canApprove(b)).toBe(false)
  })

  it('every warning needs a sign-off; notes need none', () => {
    const warnings = findings.filter((x) => x.severity === 'warning')
    const clean = findings.filter((x) => x.severity !== 'error')
    expect(approvalBlockers(clean, []).unacknowledged.map((x) => x.code)).toEqual(['air-trap', 'low-flow'])
    expect(canApprove(approvalBlockers(clean, [warnings[0]!.key]))).toBe(false)
    expect(canApprove(approvalBlockers(clean, warnings.map((x) => x.key)))).toBe(true)
  })

  it('a sign-off of a finding that is not there does not count', () => {
    const clean = findings.filter((x) => x.severity !== 'error')
    expect(canApprove(approvalBlockers(clean, ['air-trap|h9', 'low-flow|h9']))).toBe(false)
  })
})

describe('who decides a review', () => {
  // our workshop rule: reviewers and owners decide; nobody decides their own submission unless the
  // owner switched fabricatorMayApproveOwn on, and then fabricators (and owners) may
  const table: Array<[(typeof roles)[number], boolean, boolean, boolean]> = [
    // role, is submitter, setting on, may decide
    ['reviewer', false, false, true],
    ['owner', false, false, true],
    ['fabricator', false, false, false],
    ['technician', false, false, false],
    ['owner', true, false, false],
    ['fabricator', true, false, false],
    ['fabricator', true, true, true],
    ['owner', true, true, true],
    ['fabricator', false, true, false],
    ['technician', true, true, false],
    ['technician', false, true, false],
    ['reviewer', false, true, true],
  ]
  for (const [role, isSubmitter, fabricatorMayApproveOwn, may] of table) {
    it(`${role}${isSubmitter ? ' (own submission)' : ''}, setting ${fabricatorMayApproveOwn ? 'on' : 'off'}: ${may ? 'may' : 'may not'}`, () => {
      expect(decisionRefusal({ role, isSubmitter, fabricatorMayApproveOwn }) === null).toBe(may)
    })
  }

  it('says why: role or own submission', () => {
    expect(decisionRefusal({ role: 'technician', isSubmitter: false, fabricatorMayApproveOwn: false })).toBe('role')
    expect(decisionRefusal({ role: 'owner', isSubmitter: true, fabricatorMayApproveOwn: false })).toBe('own-submission')
  })
})
