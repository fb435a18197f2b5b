// Fonts for the build-sheet PDF: the app's own Atkinson Hyperlegible (shipped with the app in
// node_modules), else DejaVu Sans from the system, else the PDF's built-in Helvetica. Characters a
// font cannot draw are written as plain ASCII ("≈" → "~", "→" → "->") rather than as empty boxes.
import { existsSync, readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'

export interface SheetFonts {
  regular: Buffer | 'Helvetica'
  bold: Buffer | 'Helvetica-Bold'
  italic: Buffer | 'Helvetica-Oblique'
  /** the characters the regular font has no glyph for are replaced by these (or dropped) */
  substitutes: Record<string, string>
  /** true when the font can draw this code point */
  covers: (codePoint: number) => boolean
}

const FONTSOURCE = '@fontsource/atkinson-hyperlegible/files/atkinson-hyperlegible-latin-'
const DEJAVU = '/usr/share/fonts/truetype/dejavu/DejaVuSans'

/** Plain stand-ins for the symbols the shop's texts use. */
const ASCII: Record<string, string> = {
  '≈': '~', '→': '->', '←': '<-', '≥': '>=', '≤': '<=', 'Σ': 'Sum ', 'π': 'pi', '✓': 'x', '☐': '[ ]', '−': '-', '‑': '-',
  '›': '>', '×': 'x', '–': '-', '—': '-', '·': '-', '…': '...', '“': '"', '”': '"', '‘': "'", '’': "'", '°': ' deg ', '±': '+/-',
}

function resolveFile(spec: string): string | null {
  for (const base of [import.meta.url, join(process.cwd(), 'package.json')]) {
    try {
      const path = createRequire(base).resolve(spec)
      if (existsSync(path)) return path
    } catch { /* not reachable from here: try the next base */ }
  }
  return null
}

// WinAnsi (the built-in fonts' encoding): Latin-1 and a handful of punctuation
const WIN_ANSI_EXTRA = new Set([...'€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ'].map((c) => c.codePointAt(0)!))

let cached: SheetFonts | undefined

/** The regular face as pdfkit loaded it (its fontkit font), to ask which characters it has. */
interface LoadedFace { _font?: { font?: { hasGlyphForCodePoint?: (cp: number) => boolean } } }

export function sheetFonts(): SheetFonts {
  if (cached) return cached
  const woff = (weight: string) => resolveFile(`${FONTSOURCE}${weight}.woff`)
  const files = [woff('400-normal'), woff('700-normal'), woff('400-italic')]
  const dejavu = [`${DEJAVU}.ttf`, `${DEJAVU}-Bold.ttf`, `${DEJAVU}-Oblique.ttf`]
  const chosen = files.every((f) => f !== null) ? files as string[] : dejavu.every((f) => existsSync(f)) ? dejavu : null
  if (chosen) {
    const [regular, bold, italic] = chosen.map((f) => readFileSync(f)) as [Buffer, Buffer, Buffer]
    cached = { regular, bold, italic, substitutes: ASCII, covers: (cp) => cp < 128 }
  } else {
    cached = { regular: 'Helvetica', bold: 'Helvetica-Bold', italic: 'Helvetica-Oblique', substitutes: ASCII, covers: (cp) => cp < 256 || WIN_ANSI_EXTRA.has(cp) }
  }
  return cached
}

/** Registers the faces as 'body', 'bold' and 'italic' and learns which characters the body face has. */
export function useSheetFonts(doc: PDFKit.PDFDocument): SheetFonts {
  const fonts = sheetFonts()
  doc.registerFont('body', fonts.regular)
  doc.registerFont('bold', fonts.bold)
  doc.registerFont('italic', fonts.italic)
  doc.font('body')
  const face = (doc as unknown as LoadedFace)._font?.font
  if (typeof fonts.regular !== 'string' && face?.hasGlyphForCodePoint) {
    const has = face.hasGlyphForCodePoint.bind(face)
    return { ...fonts, covers: (cp) => has(cp) }
  }
  return fonts
}

/** The text with every character the font cannot draw replaced by its ASCII stand-in (or "?"). */
export function drawableText(fonts: SheetFonts, text: string): string {
  let out = ''
  for (const ch of text) {
    const cp = ch.codePointAt(0)!
    if (cp === 10 || cp === 9 || fonts.covers(cp)) out += ch
    else out += fonts.substitutes[ch] ?? '?'
  }
  return out
}
