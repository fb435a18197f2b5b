import { describe, expect, it } from 'vitest'
import { signUpInput, newPassword } from '#shared/schemas/auth'
import { projectInput, projectListQuery, projectUpdateInput } from '#shared/schemas/project'
import { idParam } from '#shared/schemas/common'
import { unitPreferences } from '#shared/schemas/preferences'

describe('account schemas', () => {
  it('normalises e-mail addresses so one person has one account', () => {
    const parsed = signUpInput.parse({ name: ' Ada ', email: '  Ada@Example.TEST ', password: 'long-enough-pw', workshopName: 'Shop' })
    expect(parsed.email).toBe('ada@example.test')
    expect(parsed.name).toBe('Ada')
  })

  it('asks for passwords that are long and not trivially repetitive', () => {
    expect(newPassword.safeParse('short').success).toBe(false)
    expect(newPassword.safeParse('aaaaaaaaaaaa').success).toBe(false)
    expect(newPassword.safeParse(' padded-password ').success).toBe(false)
    expect(newPassword.safeParse('ten chars!').success).toBe(true)
  })
})

describe('project schemas', () => {
  it('accepts an empty due date from a cleared date field, rejects impossible dates', () => {
    expect(projectInput.parse({ title: 'Build', dueDate: '' }).dueDate).toBeNull()
    expect(projectInput.safeParse({ title: 'Build', dueDate: '2027-02-29' }).success).toBe(false)
    expect(projectInput.parse({ title: 'Build', dueDate: '2028-02-29' }).dueDate).toBe('2028-02-29')
  })

  it('never archives through an ordinary update, and a partial update keeps absent fields absent', () => {
    expect(projectUpdateInput.safeParse({ status: 'archived' }).success).toBe(false)
    expect(projectUpdateInput.parse({ notes: 'x' })).toEqual({ notes: 'x' })
    expect(projectUpdateInput.safeParse({}).success).toBe(false)
  })

  it('coerces list query strings and bounds the page size', () => {
    expect(projectListQuery.parse({ page: '2', pageSize: '10' })).toMatchObject({ page: 2, pageSize: 10, sort: 'updatedAt', dir: 'desc', status: 'active' })
    expect(projectListQuery.safeParse({ pageSize: '1000' }).success).toBe(false)
  })

  it('route ids must be UUIDs', () => {
    expect(idParam.safeParse({ id: '1 or 1=1' }).success).toBe(false)
    expect(idParam.safeParse({ id: '0b287c9f-ef08-4c2b-be25-08df6a514d56' }).success).toBe(true)
  })
})

describe('unit preferences', () => {
  it('defaults to SI-style units with bar for pressure', () => {
    expect(unitPreferences.parse({})).toEqual({ length: 'mm', volume: 'L', temperature: 'C', pressure: 'bar' })
    expect(unitPreferences.safeParse({ length: 'furlong' }).success).toBe(false)
  })
})
