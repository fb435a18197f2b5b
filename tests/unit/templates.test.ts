import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { demoDocument } from '#shared/demo'
import { parseCircuitDocument, type Component } from '#shared/circuit'
import { componentFromTemplate, templateBody, templateFromComponent, templateInput, type TemplateBody } from '#shared/schemas/template'

// Templates are the workshop's own parts: what matters is that a saved part places back into a
// drawing as a valid part, however many times, with nothing pointing at the template's local ids.

const demoParts = () => demoDocument().circuit.components
const thermostatPart = () => demoParts().find((c): c is Extract<Component, { type: 'thermostat' }> => c.type === 'thermostat')!
const issuePaths = (input: unknown) => {
  const r = templateInput.safeParse(input)
  return r.success ? [] : r.error.issues.map(i => i.path.join('.'))
}

describe('template bodies', () => {
  it('every part of the demo drawing, without id and position, is a valid template body', () => {
    for (const part of demoParts()) {
      const body = templateFromComponent(part)
      expect(body).not.toHaveProperty('id')
      expect(body).not.toHaveProperty('position')
      expect(templateBody.safeParse(body).success, part.id).toBe(true)
    }
  })

  it('refuses an id or a position, which belong to a placed part', () => {
    const withPlacement = { ...templateFromComponent(thermostatPart()), id: 'x', position: { x: 0, y: 0, z: 0 } }
    expect(issuePaths({ name: 'Stat', body: withPlacement })).toEqual(['body'])
  })

  it('names each failing field by its path', () => {
    const body = templateFromComponent(thermostatPart()) as any
    body.ports[1].spigotOdMm = 900
    body.ports[2].role = 'sideways'
    expect(issuePaths({ name: '  ', body }).sort()).toEqual(['body.ports.1.spigotOdMm', 'body.ports.2.role', 'name'])
    expect(issuePaths({ name: 'Mystery', body: { ...body, type: 'warp-core' } })).toEqual(['body.type'])
  })

  it('checks what spans fields: unique port ids, a thermostat valve on one of its own ports, full-open above opening', () => {
    const body = templateFromComponent(thermostatPart()) as Extract<TemplateBody, { type: 'thermostat' }>
    body.ports[1]!.id = body.ports[0]!.id
    body.params.valvedPortId = 'not-here'
    body.params.fullOpenTempC = body.params.openingTempC
    expect(issuePaths({ name: 'Stat', body }).sort()).toEqual(['body.params.fullOpenTempC', 'body.params.valvedPortId', 'body.ports.1.id'])
  })
})

describe('placing a template', () => {
  it('gives every port a fresh id and keeps the thermostat valve on the same port', () => {
    const source = thermostatPart()
    const placed = componentFromTemplate(templateFromComponent(source), 'stat-2', { x: 10, y: 20, z: 30 }, (local) => `stat-2-${local}`)
    expect(placed.id).toBe('stat-2')
    expect(placed.position).toEqual({ x: 10, y: 20, z: 30 })
    expect(placed.ports.map(p => p.id)).toEqual(source.ports.map(p => `stat-2-${p.id}`))
    const valvedIndex = source.ports.findIndex(p => p.id === source.params.valvedPortId)
    expect(placed.type === 'thermostat' && placed.params.valvedPortId).toBe(placed.ports[valvedIndex]!.id)
  })

  it('does not change the template it was placed from', () => {
    const body = templateFromComponent(thermostatPart())
    const before = structuredClone(body)
    componentFromTemplate(body, 'a', { x: 0, y: 0, z: 0 }, (_l, i) => `a-${i}`)
    expect(body).toEqual(before)
  })

  it('any demo part placed any number of times leaves a document that still parses', () => {
    fc.assert(fc.property(
      fc.array(fc.record({ part: fc.nat(), x: fc.integer({ min: -5000, max: 5000 }), z: fc.integer({ min: -500, max: 2000 }) }), { minLength: 1, maxLength: 6 }),
      (placements) => {
        const doc = demoDocument()
        const parts = demoParts()
        placements.forEach((p, n) => {
          const body = templateFromComponent(parts[p.part % parts.length]!)
          const id = `placed-${n}`
          doc.circuit.components.push(componentFromTemplate(body, id, { x: p.x, y: 0, z: p.z }, (_local, i) => `${id}-port-${i}`))
        })
        const parsed = parseCircuitDocument(doc)
        expect(parsed.ok ? [] : parsed.issues).toEqual([])
      },
    ), { numRuns: 60 })
  })
})
