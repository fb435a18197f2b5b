// The top of the build sheet: what it is for (project, circuit, version, who approved it), the
// cautions, and the findings with the reasons they were signed off.
import type { ShopView } from '#shared/schemas/shop'
import { SHEET_COLOURS, sheetDate, type SheetRow, type SheetWriter } from './buildSheetPdfKit'

const { ink, soft, danger } = SHEET_COLOURS

export function drawTitleBlock(w: SheetWriter, view: ShopView, paperLabel: string) {
  const d = w.doc
  d.font('bold').fontSize(9).fillColor(soft).text(w.t(`BUILD SHEET · ${view.project.title}`), w.left, d.y, { width: w.width })
  d.moveDown(0.2)
  d.font('bold').fontSize(18).fillColor(ink).text(w.t(view.circuit.title), { width: w.width })
  d.moveDown(0.2)
  d.font('body').fontSize(10).fillColor(ink)
    .text(w.t(`Project: ${view.project.title}`), { width: w.width })
    .text(w.t(`Version ${view.version}, saved ${sheetDate(view.savedAt)}${view.savedBy ? ` by ${view.savedBy.name}` : ''}`), { width: w.width })
  d.moveDown(0.3)
  if (view.approval) {
    d.font('bold').fontSize(11).fillColor('#1f5e2f')
      .text(w.t(`Approved for the first fill by ${view.approval.by?.name ?? 'a former member'} on ${sheetDate(view.approval.at, false)}`), { width: w.width })
    if (view.approval.note.trim()) d.font('italic').fontSize(9.5).fillColor(ink).text(w.t(`“${view.approval.note.trim()}”`), { width: w.width })
  } else {
    const approved = view.reviewStatus.approved
    d.font('bold').fontSize(11).fillColor(danger)
      .text(w.t(`NOT APPROVED: version ${view.version} has not been approved for the first fill. Do not fill from this sheet.`), { width: w.width })
    if (approved) d.font('body').fontSize(9.5).fillColor(ink).text(w.t(`Version ${approved.version} is the approved one.`), { width: w.width })
  }
  d.moveDown(0.2)
  d.font('body').fontSize(8).fillColor(soft)
    .text(w.t(`Printed ${sheetDate(new Date().toISOString())} on ${paperLabel} · engine ${view.engineVersion} · sizes in mm and inches, volumes in L and US quarts, pressures in bar, kPa and psi`), { width: w.width })
  d.moveDown(0.6)
}

/** The cautions of the procedure, boxed in red before anything else. */
export function drawCautions(w: SheetWriter, view: ShopView) {
  const cautions = view.procedure.available ? view.procedure.steps.filter((s) => s.kind === 'caution') : []
  if (cautions.length === 0) return
  const d = w.doc
  const pad = 8
  const inner = w.width - 2 * pad - 12
  d.font('body').fontSize(9.5)
  const textHeights = cautions.map((c) => d.heightOfString(w.t(c.text), { width: inner }) + 3)
  const height = 2 * pad + 18 + textHeights.reduce((s, h) => s + h, 0)
  w.ensure(height)
  const top = d.y
  d.save().lineWidth(2).strokeColor(danger).rect(w.left, top, w.width, height).stroke().restore()
  d.font('bold').fontSize(12).fillColor(danger).text(w.t('Cautions: read before you start'), w.left + pad, top + pad, { width: w.width - 2 * pad })
  let y = top + pad + 18
  cautions.forEach((c, i) => {
    d.font('bold').fontSize(9.5).fillColor(danger).text('!', w.left + pad, y, { width: 10 })
    d.font('body').fontSize(9.5).fillColor(ink).text(w.t(c.text), w.left + pad + 12, y, { width: inner })
    y += textHeights[i]!
  })
  d.x = w.left
  d.y = top + height + 8
}

export function drawFindings(w: SheetWriter, view: ShopView) {
  w.heading('Findings and sign-offs')
  if (view.findings.length === 0) {
    w.para('The check finds nothing to report on this version.')
    return
  }
  const rows: SheetRow[] = view.findings.map((f) => ({
    cells: [
      { text: f.severity.toUpperCase(), bold: true, colour: f.severity === 'error' ? danger : f.severity === 'warning' ? '#8f5b00' : '#2f5d8a' },
      `${f.message}\nFix: ${f.fix}`,
      f.signOff
        ? `“${f.signOff.justification}”\n${f.signOff.by?.name ?? 'a former member'}, ${sheetDate(f.signOff.at, false)}`
        : { text: f.severity === 'warning' ? 'not signed off' : f.severity === 'error' ? 'must be fixed' : 'note: no sign-off needed', italic: true, colour: soft },
    ],
  }))
  w.table([{ title: 'Severity', share: 11 }, { title: 'Finding', share: 55 }, { title: 'Signed off because', share: 34 }], rows)
}
