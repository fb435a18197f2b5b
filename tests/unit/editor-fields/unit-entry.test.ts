// What the inspector stores for what a person types, in their own units. Conversion factors are the
// exact definitions in shared/physics/units.ts (25.4 mm/in by the 1959 international yard and pound
// agreement; US quart = 57.75 in³; °F = 1.8·°C + 32; psi from lbf and the inch).
import { describe, expect, it } from 'vitest'
import { entryText, parseEntry, quantityText, unitsOf } from '../../../app/composables/useUnitField'
import { fromDisplay, toDisplay } from '#shared/physics/units'

const metric = unitsOf({ length: 'mm', volume: 'L', temperature: 'C', pressure: 'kPa' })
const us = unitsOf({ length: 'in', volume: 'qt', temperature: 'F', pressure: 'psi' })
const value = (r: ReturnType<typeof parseEntry>) => (r.ok ? r.value : r.message)

describe('parseEntry', () => {
  it('reads a bare number in the preferred unit, exactly', () => {
    expect(value(parseEntry('length', '157.5', us))).toBe(4000.5) // 157.5 × 25.4
    expect(value(parseEntry('length', '1.25', us))).toBe(31.75)
    expect(value(parseEntry('length', '-3', us))).toBe(-76.2)
    expect(value(parseEntry('length', '12,5', metric))).toBe(12.5)
    expect(value(parseEntry('temperature', '212', us))).toBe(100) // (212 − 32) / 1.8
    expect(value(parseEntry('volume', '4', us))).toBe(3.785411784) // 4 qt = 1 US gal = 231 in³
    expect(value(parseEntry('pressure', '15', us))).toBe(Number(fromDisplay('pressure', 15, us).toPrecision(12)))
  })

  it('takes hose sizes as fractions, mixed numbers or millimetres whatever the preference', () => {
    expect(value(parseEntry('hoseSize', '5/16 in', metric))).toBe(7.9375)
    expect(value(parseEntry('hoseSize', '1-1/4', metric))).toBe(31.75)
    expect(value(parseEntry('hoseSize', '8 mm', us))).toBe(8)
    expect(value(parseEntry('hoseSize', '3/4"', us))).toBe(19.05)
  })

  it('lets one entry name its own unit', () => {
    expect(value(parseEntry('temperature', '90 °C', us))).toBe(90)
    expect(value(parseEntry('pressure', '1.1 bar', us))).toBe(110)
    expect(value(parseEntry('volume', '2 L', us))).toBe(2)
    expect(value(parseEntry('length', '30 mm', us))).toBe(30)
  })

  it('refuses text that is not a quantity, naming the unit expected', () => {
    expect(parseEntry('length', '12 furlongs', us)).toEqual({ ok: false, message: expect.stringContaining('in in') })
    expect(parseEntry('pressure', 'lots', metric)).toEqual({ ok: false, message: 'Type a number in kPa' })
    expect(parseEntry('plain', '3 rpm', metric).ok).toBe(false)
    expect(parseEntry('length', '', metric)).toEqual({ ok: true, value: undefined })
  })
})

describe('entryText', () => {
  it('shows stored values in the user unit so that they read back unchanged', () => {
    // values that are whole ten-thousandths of an inch come back exactly
    for (const mm of [4000.5, 31.75, 7.9375, 1231.9, -50.8]) {
      const text = entryText('length', mm, us)
      expect(value(parseEntry('length', text, us))).toBe(mm)
    }
    expect(entryText('length', 4000.5, us)).toBe('157.5')
    expect(entryText('temperature', 100, us)).toBe('212')
    expect(toDisplay('temperature', 100, us)).toBe(212)
    // others show to 0.0001 in; untouched, they are never written back
    expect(entryText('length', 123.4, us)).toBe('4.8583')
  })

  it('names a hose size by its inch fraction when it is one', () => {
    expect(entryText('hoseSize', 15.875, us)).toBe('5/8 in')
    expect(entryText('hoseSize', 15.88, us)).toBe('5/8 in')
    expect(entryText('hoseSize', 16, us)).toBe('0.6299')
    expect(quantityText('hoseSize', 16, metric)).toBe('16 mm')
    expect(quantityText('hoseSize', 31.75, us)).toBe('1-1/4 in')
    expect(quantityText('hoseSize', 16, us)).toBe('0.63 in')
    expect(quantityText('length', 4318, us)).toBe('170 in')
    expect(quantityText('pressure', 110, metric)).toBe('110 kPa')
  })
})
