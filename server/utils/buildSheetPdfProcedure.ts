// The procedure on the build sheet, with a box to tick at every step, and the record forms: the
// pressure tests and fills already recorded in the app, then blank lines to fill in by hand.
import { pressureText, volumeText } from '#shared/shop/format'
import { PROCEDURE_PHASE_TITLES, type ProcedurePhase } from '#shared/shop'
import type { ShopView } from '#shared/schemas/shop'
import { SHEET_COLOURS, sheetDate, type SheetRow, type SheetWriter } from './buildSheetPdfKit'

const PHASE_TITLES = PROCEDURE_PHASE_TITLES
const KIND_PREFIX = { caution: 'Caution: ', step: '', check: 'Check: ', record: 'Record: ' } as const

export function drawProcedure(w: SheetWriter, view: ShopView) {
  const p = view.procedure
  w.heading(p.title)
  if (!p.available) {
    w.para(p.reason, { font: 'bold' })
    return
  }
  w.para('The cautions at the top of the sheet come first. Steps marked "rule of thumb" are trade practice, not figures from the drawing.', { size: 8.5, colour: SHEET_COLOURS.soft })
  const d = w.doc
  let phase: ProcedurePhase | null = null
  let n = 0
  for (const s of p.steps) {
    if (s.kind === 'caution' && s.phase === 'cautions') continue
    if (s.phase !== phase) {
      phase = s.phase
      w.heading(PHASE_TITLES[s.phase], 11, 30)
    }
    n += 1
    const done = view.steps[s.id]
    const text = `${n}. ${KIND_PREFIX[s.kind]}${s.text}`
    const x = w.left + 16
    const width = w.width - 16 - (s.ruleOfThumb ? 62 : 0)
    d.font(s.kind === 'record' ? 'bold' : 'body').fontSize(9.5)
    const h = d.heightOfString(w.t(text), { width }) + (done ? 11 : 0) + 4
    w.ensure(h)
    const y = d.y
    w.tickBox(w.left + 2, y + 1, Boolean(done))
    d.fillColor(SHEET_COLOURS.ink).text(w.t(text), x, y, { width })
    if (s.ruleOfThumb) {
      d.save().roundedRect(w.left + w.width - 58, y, 58, 12, 3).lineWidth(0.8).strokeColor(SHEET_COLOURS.copper).stroke().restore()
      d.font('bold').fontSize(7).fillColor(SHEET_COLOURS.copper).text('RULE OF THUMB', w.left + w.width - 58, y + 3, { width: 58, align: 'center' })
    }
    if (done) d.font('italic').fontSize(8).fillColor(SHEET_COLOURS.soft).text(w.t(`done by ${done.by?.name ?? 'a former member'}, ${sheetDate(done.at)}`), x, y + h - 15, { width })
    d.x = w.left
    d.y = y + h
  }
}

const blank = (columns: number): SheetRow => ({ cells: Array.from({ length: columns }, () => '') })

export function drawRecordForms(w: SheetWriter, view: ShopView) {
  w.heading('Pressure-test record', 14, 120)
  const figures = view.procedure.available ? view.procedure.figures : null
  if (figures?.testPressureKpa != null) {
    const p = pressureText(figures.testPressureKpa)
    w.para(`Test cold at the cap rating and not above: ${p.metric}, ${p.imperial} (gauge). Hold about 2 minutes with no drop (rule of thumb).`)
  } else {
    w.para('No pressure cap in the drawing: test at the engine maker\'s test pressure.')
  }
  const rows: SheetRow[] = view.pressureTests.map((t) => {
    const start = pressureText(t.startKpa)
    const end = pressureText(t.endKpa)
    return {
      cells: [sheetDate(t.at), `${start.metric}\n${start.imperial}`, `${end.metric}\n${end.imperial}`, String(t.minutesHeld),
        { text: t.passed ? 'PASS' : 'FAIL', bold: true, colour: t.passed ? '#1f5e2f' : SHEET_COLOURS.danger }, t.by?.name ?? '', t.note],
    }
  })
  for (let i = 0; i < 4; i++) rows.push(blank(7))
  w.table([
    { title: 'Date and time', share: 15 }, { title: 'Start pressure', share: 15 }, { title: 'End pressure', share: 15 },
    { title: 'Minutes held', share: 9 }, { title: 'Pass / fail', share: 9 }, { title: 'By', share: 13 }, { title: 'Note (cap test, leaks found)', share: 24 },
  ], rows, { blankRowHeight: 18 })

  w.heading('Coolant fill record', 14, 90)
  const estimate = volumeText(view.estimateL)
  w.para(`Estimated system volume: ${estimate.metric} (${estimate.imperial}). Clearly less going in means trapped air (rule of thumb).`)
  const fills: SheetRow[] = view.fills.map((f) => {
    const taken = volumeText(f.volumeL)
    const diff = volumeText(f.differenceL)
    return { cells: [sheetDate(f.at), `${taken.metric}\n${taken.imperial}`, `${f.differenceL > 0 ? '+' : ''}${diff.metric}\n${f.differenceL > 0 ? '+' : ''}${diff.imperial}`, f.by?.name ?? '', f.note] }
  })
  for (let i = 0; i < 2; i++) fills.push(blank(5))
  w.table([
    { title: 'Date and time', share: 17 }, { title: 'Volume taken', share: 17 }, { title: 'Against the estimate', share: 17 }, { title: 'By', share: 15 }, { title: 'Note', share: 34 },
  ], fills, { blankRowHeight: 18 })
}
