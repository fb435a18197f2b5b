// The shopping list and the cut list on the build sheet, as shared/shop wrote them, with the
// workshop's prices and the ticks made in the app (empty boxes to tick by hand otherwise).
import type { ShopLineView, ShopView } from '#shared/schemas/shop'
import { SHEET_COLOURS, type SheetRow, type SheetWriter } from './buildSheetPdfKit'

const money = (n: number | null) => (n === null ? '' : n.toFixed(2))
const both = (metric: string, imperial: string) => (imperial && imperial !== metric ? `${metric}\n${imperial}` : metric)
/** Who ticked it, as initials: the column is narrow and the app shows the full name and time. */
const initials = (tick: ShopLineView['bought']) => (tick ? (tick.by?.name ?? '?').split(/\s+/).map((p) => p[0] ?? '').join('').toUpperCase() : '')

export function drawShoppingList(w: SheetWriter, view: ShopView) {
  const list = view.list
  w.heading('Shopping list')
  const bought = list.lines.filter((l) => l.parentId === null)
  const rows: SheetRow[] = []
  for (const s of list.sections) {
    const total = s.priceTotal !== null ? `priced ${s.pricedLines} of ${s.lines}, ${money(s.priceTotal)}` : `${s.lines} line${s.lines === 1 ? '' : 's'}`
    rows.push({ group: s.title, note: total })
    for (const l of bought.filter((x) => x.section === s.section)) rows.push({ cells: lineCells(l) })
  }
  w.table([
    { title: 'Item', share: 30 }, { title: 'Size (metric / imperial)', share: 19 }, { title: 'Quantity', share: 16 },
    { title: 'Price each', share: 8, align: 'right' }, { title: 'Supplier', share: 11 }, { title: 'Bought', share: 8 }, { title: 'Fitted', share: 8 },
  ], rows)
  const t = list.total
  w.para(`${t.lines} lines to buy; ${t.pricedLines} priced${t.priceTotal !== null ? `, total ${money(t.priceTotal)}${t.complete ? '' : ' so far'}` : ''}.`, { font: 'bold' })
  if (list.attention.length > 0) {
    w.para('Still to settle before buying:', { font: 'bold', colour: SHEET_COLOURS.danger })
    for (const a of list.attention) w.para(`• ${a}`, { indent: 8 })
  }
  w.para('How the quantities were rounded:', { font: 'bold', size: 8.5 })
  for (const r of list.rules) w.para(`• ${r}`, { size: 8, indent: 8, colour: SHEET_COLOURS.soft })
}

function lineCells(l: ShopLineView) {
  return [
    { text: l.description, sub: l.notes },
    both(l.sizes.metric, l.sizes.imperial),
    both(l.quantityText.metric, l.quantityText.imperial),
    money(l.price),
    l.supplier ?? '',
    { text: initials(l.bought), tick: Boolean(l.bought) },
    { text: initials(l.fitted), tick: Boolean(l.fitted) },
  ]
}

/** The pieces to cut, H1, H2 …, each with both ends and the clamp at each end. */
export function drawCutList(w: SheetWriter, view: ShopView) {
  const cuts = view.list.lines.filter((l) => l.parentId !== null)
  w.heading('Cut list')
  if (cuts.length === 0) {
    w.para('No hoses in this drawing.')
    return
  }
  const parents = new Map(view.list.lines.map((l) => [l.id, l]))
  const rows: SheetRow[] = cuts.map((c) => ({
    cells: [
      c.description,
      both(c.sizes.metric, c.sizes.imperial),
      { text: parents.get(c.parentId!)?.description ?? '', sub: c.notes },
      { text: initials(c.bought), tick: Boolean(c.bought) },
      { text: initials(c.fitted), tick: Boolean(c.fitted) },
    ],
  }))
  w.table([
    { title: 'Piece and ends', share: 32 }, { title: 'Cut length', share: 16 }, { title: 'From, allowance and clamps', share: 36 },
    { title: 'Cut', share: 8 }, { title: 'Fitted', share: 8 },
  ], rows)
}
