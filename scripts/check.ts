// Checks a circuit document from the command line.
//   npm run check -- path/to/circuit.json [--format json|text]
//   npm run check -- --demo [corrected]     prints the demo circuit document (used for docs/exchange-format.md)
//   npm run check -- --demo fuel [corrected] prints the demo's fuel conversion
// Exit status: 0 no error finding, 1 at least one error finding, 2 the document is not valid (or unreadable).
import { readFileSync } from 'node:fs'
import { formatIssues, parseCircuitDocument } from '../shared/circuit'
import { correctedDemoDocument, correctedFuelDemoDocument, demoDocument, fuelDemoDocument } from '../shared/demo'
import { analyzeCircuit, formatReportText } from '../shared/engine'

function usage(): never {
  process.stderr.write('Usage: npm run check -- <circuit.json> [--format json|text]   |   npm run check -- --demo [fuel] [corrected]\n')
  process.exit(2)
}

const args = process.argv.slice(2)
if (args[0] === '--demo') {
  const fuel = args[1] === 'fuel'
  const corrected = args[fuel ? 2 : 1] === 'corrected'
  const doc = fuel ? (corrected ? correctedFuelDemoDocument() : fuelDemoDocument()) : corrected ? correctedDemoDocument() : demoDocument()
  process.stdout.write(`${JSON.stringify(doc, null, 2)}\n`)
  process.exit(0)
}
let format: 'json' | 'text' = 'json'
let path: string | undefined
for (let i = 0; i < args.length; i++) {
  const a = args[i]!
  if (a === '--format') {
    const f = args[++i]
    if (f !== 'json' && f !== 'text') usage()
    format = f
  } else if (a.startsWith('--format=')) {
    const f = a.slice('--format='.length)
    if (f !== 'json' && f !== 'text') usage()
    format = f
  } else if (!path) path = a
  else usage()
}
if (!path) usage()

let text: string
try {
  text = readFileSync(path, 'utf8')
} catch (e) {
  process.stderr.write(`Cannot read ${path}: ${(e as Error).message}\n`)
  process.exit(2)
}
const parsed = parseCircuitDocument(text)
if (!parsed.ok) {
  process.stderr.write(`${path} is not a valid circuit document:\n`)
  for (const line of formatIssues(parsed.issues)) process.stdout.write(`${line}\n`)
  process.exit(2)
}
const report = analyzeCircuit(parsed.document)
process.stdout.write(format === 'json' ? `${JSON.stringify(report, null, 2)}\n` : formatReportText(report, parsed.document.circuit.title))
process.exit(report.counts.error > 0 ? 1 : 0)
