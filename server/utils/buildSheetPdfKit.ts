// Layout helpers for the build-sheet PDF on top of pdfkit: headings and paragraphs that never start
// at the foot of a page, tick boxes, and tables that break between rows and repeat their header.
import PDFDocument from 'pdfkit'
import type { PaperSize } from '#shared/schemas/shop'
import { drawableText, useSheetFonts, type SheetFonts } from './buildSheetPdfFonts'

/** The app's colours (tailwind.config.ts), for print. */
export const SHEET_COLOURS = {
  ink: '#14202b', soft: '#5b6d7b', line: '#c9d1d6', sunk: '#ebe6de', danger: '#b3261e', coolant: '#0d6b73', copper: '#a8470f',
} as const
const { ink: INK, soft: SOFT, line: LINE, sunk: SUNK, coolant: COOLANT } = SHEET_COLOURS

/** Dates on paper: the day and time in UTC, said so, since the sheet travels. */
export function sheetDate(iso: string, withTime = true): string {
  const d = new Date(iso)
  const day = d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })
  return withTime ? `${day}, ${d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' })} UTC` : day
}

/** A table cell: plain text, or text with a smaller grey line under it (`sub`) and/or a tick box in front. */
export type SheetCell = string | { text: string; sub?: string; bold?: boolean; italic?: boolean; colour?: string; tick?: boolean | null }
export interface SheetColumn { title: string; share: number; align?: 'left' | 'right' | 'center' }
export type SheetRow = { cells: SheetCell[] } | { group: string; note?: string }

export class SheetWriter {
  readonly doc: PDFKit.PDFDocument
  readonly fonts: SheetFonts

  constructor(paper: PaperSize, info: { title: string; subject: string }) {
    this.doc = new PDFDocument({
      size: paper === 'a4' ? 'A4' : 'LETTER',
      margins: { top: 42, bottom: 52, left: 42, right: 42 },
      bufferPages: true,
      info: { Title: info.title, Subject: info.subject, Creator: 'Hosewright' },
    })
    this.fonts = useSheetFonts(this.doc)
  }

  get left() { return this.doc.page.margins.left }
  get width() { return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right }
  get bottom() { return this.doc.page.height - this.doc.page.margins.bottom }

  t(text: string): string { return drawableText(this.fonts, text) }

  /** Starts a new page unless `height` points still fit on this one. */
  ensure(height: number) {
    if (this.doc.y + height > this.bottom) this.doc.addPage()
  }

  heading(text: string, size = 14, keepWith = 60) {
    this.ensure(size * 1.6 + keepWith)
    this.doc.moveDown(0.6).font('bold').fontSize(size).fillColor(INK).text(this.t(text), this.left, this.doc.y, { width: this.width })
    this.doc.moveDown(0.25)
  }

  para(text: string, options: { size?: number; font?: 'body' | 'bold' | 'italic'; colour?: string; indent?: number } = {}) {
    const size = options.size ?? 9.5
    const x = this.left + (options.indent ?? 0)
    const width = this.width - (options.indent ?? 0)
    this.doc.font(options.font ?? 'body').fontSize(size)
    const h = this.doc.heightOfString(this.t(text), { width })
    this.ensure(h)
    this.doc.fillColor(options.colour ?? INK).text(this.t(text), x, this.doc.y, { width })
  }

  /** A square to tick by hand; filled with a cross when already ticked in the app. */
  tickBox(x: number, y: number, ticked: boolean, size = 9) {
    const d = this.doc
    d.save().lineWidth(0.9).strokeColor(INK).rect(x, y, size, size).stroke()
    if (ticked) d.moveTo(x + 2, y + 2).lineTo(x + size - 2, y + size - 2).moveTo(x + size - 2, y + 2).lineTo(x + 2, y + size - 2).stroke()
    d.restore()
  }

  private cellHeight(cell: SheetCell, width: number, size: number): number {
    const c = typeof cell === 'string' ? { text: cell } : cell
    if (c.tick !== undefined && c.text === '') return size + 4
    const w = c.tick !== undefined && c.tick !== null ? width - 12 : width
    this.doc.font(c.bold ? 'bold' : c.italic ? 'italic' : 'body').fontSize(size)
    const main = this.doc.heightOfString(this.t(c.text || ' '), { width: w })
    if (!c.sub) return main
    this.doc.font('body').fontSize(size - 1.5)
    return main + 1 + this.doc.heightOfString(this.t(c.sub), { width: w })
  }

  private drawHeader(columns: SheetColumn[], widths: number[], size: number) {
    const d = this.doc
    const pad = 3
    d.font('bold').fontSize(size)
    const h = Math.max(...columns.map((c, i) => d.heightOfString(this.t(c.title), { width: widths[i]! - 2 * pad }))) + 2 * pad
    const y = d.y
    d.save().rect(this.left, y, this.width, h).fill(SUNK).restore()
    let x = this.left
    columns.forEach((c, i) => {
      d.font('bold').fontSize(size).fillColor(INK).text(this.t(c.title), x + pad, y + pad, { width: widths[i]! - 2 * pad, align: c.align ?? 'left' })
      x += widths[i]!
    })
    d.y = y + h
  }

  /**
   * A table that breaks between rows, never inside one, and repeats its header on every page it
   * runs onto. A group row is kept with the row after it.
   */
  table(columns: SheetColumn[], rows: SheetRow[], options: { size?: number; blankRowHeight?: number } = {}) {
    const d = this.doc
    const size = options.size ?? 8.5
    const pad = 3
    const total = columns.reduce((s, c) => s + c.share, 0)
    const widths = columns.map((c) => (c.share / total) * this.width)
    const heights = rows.map((r) => 'group' in r
      ? this.cellHeight({ text: r.group + (r.note ? `  ${r.note}` : ''), bold: true }, this.width - 2 * pad, size) + 2 * pad
      : Math.max(options.blankRowHeight ?? 0, ...r.cells.map((c, i) => this.cellHeight(c, widths[i]! - 2 * pad, size))) + 2 * pad)
    this.ensure(24 + (heights[0] ?? 0) + (heights[1] ?? 0))
    this.drawHeader(columns, widths, size)
    rows.forEach((row, i) => {
      const keep = 'group' in row ? (heights[i + 1] ?? 0) : 0
      if (d.y + heights[i]! + keep > this.bottom) {
        d.addPage()
        this.drawHeader(columns, widths, size)
      }
      const y = d.y
      if ('group' in row) {
        d.font('bold').fontSize(size).fillColor(COOLANT).text(this.t(row.group), this.left + pad, y + pad, { width: this.width - 2 * pad, continued: Boolean(row.note) })
        if (row.note) d.font('body').fillColor(SOFT).text(this.t(`  ${row.note}`))
      } else {
        let x = this.left
        row.cells.forEach((cell, j) => {
          const c = typeof cell === 'string' ? { text: cell } : cell
          if (c.tick !== undefined && c.tick !== null) this.tickBox(x + pad, y + pad, c.tick)
          const tx = c.tick !== undefined && c.tick !== null ? x + pad + 12 : x + pad
          const tw = widths[j]! - 2 * pad - (tx - x - pad)
          if (c.text) d.font(c.bold ? 'bold' : c.italic ? 'italic' : 'body').fontSize(size).fillColor(c.colour ?? INK).text(this.t(c.text), tx, y + pad, { width: tw, align: columns[j]!.align ?? 'left' })
          if (c.sub) d.font('body').fontSize(size - 1.5).fillColor(SOFT).text(this.t(c.sub), tx, d.y + 1, { width: tw, align: columns[j]!.align ?? 'left' })
          x += widths[j]!
        })
      }
      d.save().lineWidth(0.5).strokeColor(LINE).moveTo(this.left, y + heights[i]!).lineTo(this.left + this.width, y + heights[i]!).stroke().restore()
      d.y = y + heights[i]!
    })
    d.x = this.left
    d.moveDown(0.5)
  }

  /** "Page n of N" and the sheet's name at the foot of every page. */
  pageNumbers(footer: string) {
    const d = this.doc
    const range = d.bufferedPageRange()
    for (let i = range.start; i < range.start + range.count; i++) {
      d.switchToPage(i)
      const bottom = d.page.margins.bottom
      d.page.margins.bottom = 0
      d.font('body').fontSize(8).fillColor(SOFT)
      d.text(this.t(footer), this.left, d.page.height - 34, { width: this.width * 0.75, lineBreak: false })
      d.text(`Page ${i + 1 - range.start} of ${range.count}`, this.left, d.page.height - 34, { width: this.width, align: 'right', lineBreak: false })
      d.page.margins.bottom = bottom
    }
  }

  async finish(): Promise<Buffer> {
    const chunks: Buffer[] = []
    const done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (c: Buffer) => chunks.push(c))
      this.doc.on('end', () => resolve(Buffer.concat(chunks)))
      this.doc.on('error', reject)
    })
    this.doc.end()
    return await done
  }
}
