// The list as CSV (papaparse), read back with papaparse.
import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { correctedDemoDocument } from '#shared/demo'
import { CSV_COLUMNS, shoppingLinesFromCsv, shoppingList, shoppingListCsv } from '#shared/shop'

const doc = correctedDemoDocument()
const list = shoppingList(doc, analyzeCircuit(doc), {
  customLines: [
    { id: 'sleeve', description: 'Heat sleeve, "fire" grade, 25 mm', quantity: 1.5, unit: 'm', price: 7.25, supplier: 'Counter, aisle 3', notes: 'two lines\nof notes' },
    { id: 'formula', description: '=SUM(A1:A9)', quantity: 1, unit: 'piece', notes: '-5 % off', sizes: { metric: '+1', imperial: '@x' } },
  ],
  prices: { 'cap/tank': { price: 1234.56 } },
})
const csv = shoppingListCsv(list)

describe('shoppingListCsv', () => {
  it('has a header row with the documented columns, in order', () => {
    const parsed = Papa.parse<string[]>(csv)
    expect(parsed.data[0]).toEqual([...CSV_COLUMNS])
    expect(parsed.data.length - 1).toBe(list.lines.length)
  })
  it('round-trips: parsed back with papaparse it equals the list, commas, quotes and new lines included', () => {
    expect(shoppingLinesFromCsv(csv)).toEqual(list.lines)
  })
  it('writes numbers with a dot decimal and leaves prices empty until filled', () => {
    const rows = Papa.parse<Record<string, string>>(csv, { header: true }).data
    const cap = rows.find((r) => r.id === 'cap/tank')!
    expect(cap.price).toBe('1234.56')
    expect(rows.find((r) => r.id === 'custom/sleeve')!.quantity).toBe('1.5')
    expect(rows.find((r) => r.id === 'thermostat/thermostat')!.price).toBe('')
  })
  it('keeps a spreadsheet from running text as a formula (leading apostrophe), and takes it off on reading', () => {
    const row = Papa.parse<Record<string, string>>(csv, { header: true }).data.find((r) => r.id === 'custom/formula')!
    expect(row.description).toBe("'=SUM(A1:A9)")
    expect(row.notes).toBe("'-5 % off")
    expect(shoppingLinesFromCsv(csv).find((l) => l.id === 'custom/formula')!.description).toBe('=SUM(A1:A9)')
  })
  it('reads a list the workshop priced in a spreadsheet, and refuses a comma decimal', () => {
    const rows = Papa.parse<Record<string, string>>(csv, { header: true }).data
    rows.find((r) => r.id === 'thermostat/thermostat')!.price = '18.9'
    const priced = shoppingLinesFromCsv(Papa.unparse(rows))
    expect(priced.find((l) => l.id === 'thermostat/thermostat')!.price).toBe(18.9)
    rows.find((r) => r.id === 'thermostat/thermostat')!.price = '18,9'
    expect(() => shoppingLinesFromCsv(Papa.unparse(rows))).toThrow(/dot decimal/)
  })
})
