import { describe, expect, it } from 'vitest'
import { can, capabilities, type Capability } from '#shared/permissions'
import { roles } from '#shared/schemas/membership'

// The workshop's division of labour: fabricators draw, reviewers sign off, technicians fit.
const expected: Record<Capability, Record<(typeof roles)[number], boolean>> = {
  'workshop:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'members:manage': { owner: true, fabricator: false, reviewer: false, technician: false },
  'project:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'project:write': { owner: true, fabricator: true, reviewer: false, technician: false },
  'circuit:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'circuit:write': { owner: true, fabricator: true, reviewer: false, technician: false },
  // the workshop's part library: everyone looks parts up, those who draw keep it
  'template:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'template:write': { owner: true, fabricator: true, reviewer: false, technician: false },
  // review: fabricators put versions up, reviewers and owners sign off, technicians read the result
  'review:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'review:submit': { owner: true, fabricator: true, reviewer: false, technician: false },
  'review:decide': { owner: true, fabricator: false, reviewer: true, technician: false },
  'comment:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'comment:write': { owner: true, fabricator: true, reviewer: true, technician: true },
  'comment:moderate': { owner: true, fabricator: false, reviewer: false, technician: false },
  'activity:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  // shop outputs: the whole team reads the records; technicians, owners and fabricators make them
  'shop:read': { owner: true, fabricator: true, reviewer: true, technician: true },
  'shop:record': { owner: true, fabricator: true, reviewer: false, technician: true },
  'workshop:settings': { owner: true, fabricator: false, reviewer: false, technician: false },
}

describe('role rules', () => {
  it('every capability has an expectation for every role', () => {
    expect(Object.keys(capabilities).sort()).toEqual(Object.keys(expected).sort())
  })

  for (const [capability, byRole] of Object.entries(expected)) {
    for (const role of roles) {
      it(`${role} ${byRole[role] ? 'may' : 'may not'} ${capability}`, () => {
        expect(can(role, capability as Capability)).toBe(byRole[role])
      })
    }
  }

  it('nobody without a role may do anything', () => {
    for (const capability of Object.keys(capabilities) as Capability[]) expect(can(null, capability)).toBe(false)
  })
})
