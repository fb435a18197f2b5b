// The build sheet of a version as a PDF, made on the server with pdfkit: the same content as the
// printable page (app/pages/circuits/[id]/build-sheet/[version].vue), page numbers at the foot,
// tables that break between rows and repeat their header.
import type { PaperSize, ShopView } from '#shared/schemas/shop'
import { drawCharts } from './buildSheetPdfCharts'
import { drawViews } from './buildSheetPdfDrawing'
import { drawCautions, drawFindings, drawTitleBlock } from './buildSheetPdfHead'
import { SheetWriter } from './buildSheetPdfKit'
import { drawCutList, drawShoppingList } from './buildSheetPdfLists'
import { drawProcedure, drawRecordForms } from './buildSheetPdfProcedure'
import { fileSlug } from './shopActivity'

const PAPER_LABELS: Record<PaperSize, string> = { a4: 'A4', letter: 'US Letter' }

export function buildSheetFilename(view: Pick<ShopView, 'circuit' | 'version'>): string {
  return `${fileSlug(view.circuit.title)}-v${view.version}-build-sheet.pdf`
}

export async function buildSheetPdf(view: ShopView, paper: PaperSize = 'a4'): Promise<Buffer> {
  const w = new SheetWriter(paper, {
    title: `Build sheet: ${view.circuit.title}, version ${view.version}`,
    subject: `${view.project.title} · ${view.approval ? 'approved for the first fill' : 'not approved'}`,
  })
  drawTitleBlock(w, view, PAPER_LABELS[paper])
  drawCautions(w, view)
  await drawViews(w, view.document)
  drawFindings(w, view)
  drawShoppingList(w, view)
  drawCutList(w, view)
  drawProcedure(w, view)
  drawRecordForms(w, view)
  drawCharts(w, view)
  w.pageNumbers(`${view.circuit.title} · version ${view.version}${view.approval ? ' · approved' : ' · NOT APPROVED'}`)
  return await w.finish()
}
