// Both views of the drawing for the PDF: the app's own SVG export (shared/drawing), rendered to PNG
// by sharp (librsvg) at about 200 dpi across the page, so no second drawing code is needed.
import sharp from 'sharp'
import type { CircuitDocument } from '#shared/circuit'
import { documentToSvg, drawingTheme, VIEWS, type ThemeColours, type ViewName } from '#shared/drawing'
import tailwindConfig from '../../tailwind.config'
import { SHEET_COLOURS, type SheetWriter } from './buildSheetPdfKit'

const theme = drawingTheme(tailwindConfig.theme.extend.colors as unknown as ThemeColours)

/** 1500 px across ~7.2 in of A4 or Letter text width ≈ 200 dpi. */
const DRAWING_WIDTH_PX = 1500

export async function viewPng(document: CircuitDocument, view: ViewName): Promise<Buffer> {
  const svg = documentToSvg(document, view, theme, { widthPx: DRAWING_WIDTH_PX })
  return await sharp(Buffer.from(svg), { density: 72 }).png({ compressionLevel: 9 }).toBuffer()
}

export async function drawViews(w: SheetWriter, document: CircuitDocument, maxHeight = 300) {
  const views: ViewName[] = ['side', 'top']
  const images = await Promise.all(views.map((v) => viewPng(document, v)))
  for (const [i, png] of images.entries()) {
    const meta = await sharp(png).metadata()
    const aspect = (meta.height ?? 1) / (meta.width ?? 1)
    const height = Math.min(maxHeight, w.width * aspect)
    const width = height / aspect
    w.heading(VIEWS[views[i]!].title, 11, height + 6)
    const y = w.doc.y
    w.doc.image(png, w.left + (w.width - width) / 2, y, { width, height })
    w.doc.save().lineWidth(0.6).strokeColor(SHEET_COLOURS.line).rect(w.left + (w.width - width) / 2, y, width, height).stroke().restore()
    w.doc.y = y + height + 4
  }
}
