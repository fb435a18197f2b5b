import { execFileSync } from 'node:child_process'
import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sql } from '../helpers/db'
import { waitForMail } from '../helpers/mail'
import { approvedDemoBuild, getBytes, readPdf, type ApprovedBuild } from './shopFixtures'

// The build sheet made on the server (pdfkit), read back with pdfinfo and pdftotext, and the same
// PDF attached to the approval e-mail as it arrives at the fake SMTP server.
afterAll(() => sql.end())

let b: ApprovedBuild
let base: string

beforeAll(async () => {
  b = await approvedDemoBuild('shopsheet')
  base = `/api/circuits/${b.circuitId}/versions/${b.version}/shop`
  await b.tech.post(`${base}/pressure-tests`, { unit: 'psi', startPressure: 16, endPressure: 16, minutesHeld: 5, passed: true, note: 'Held on the adapter.' })
})

describe('build sheet PDF from the server', () => {
  for (const [paper, size] of [['a4', '595.28 x 841.89 pts (A4)'], ['letter', '612 x 792 pts (letter)']] as const) {
    it(`${paper}: pages numbered, with the title, version, approver, cut list, cautions and the pressure-test record`, async () => {
      const res = await getBytes(b.tech, `${base}/build-sheet.pdf?paper=${paper}`)
      expect(res.status).toBe(200)
      expect(res.headers.get('content-type')).toBe('application/pdf')
      expect(res.headers.get('content-disposition')).toMatch(/-v\d+-build-sheet\.pdf"$/)
      const pdf = readPdf(res.bytes)
      expect(pdf.pageSize).toBe(size)
      // header, both drawings, findings, two lists, the procedure, the forms and the charts do not fit on fewer than 4 pages
      expect(pdf.pages).toBeGreaterThanOrEqual(4)
      const text = pdf.text.replace(/\s+/g, ' ')
      for (const wanted of [b.projectTitle, b.circuitTitle, `Version ${b.version}`, `Approved for the first fill by ${b.names.rev}`, 'H1', 'Never open', 'Pressure-test record', 'Cut list', 'Shopping list', 'Side view', 'Top view', 'RULE OF THUMB', 'PASS']) {
        expect(text, wanted).toContain(wanted)
      }
      expect(text).toContain(`Page 1 of ${pdf.pages}`)
      expect(text).toContain(`Page ${pdf.pages} of ${pdf.pages}`)
      // the cautions come before the procedure's first step
      expect(text.indexOf('Never open')).toBeLessThan(text.indexOf('Pressure-test record'))
      // the first pages as pictures, for people to look at (git-ignored)
      const shots = resolve(import.meta.dirname, '../screenshots')
      mkdirSync(shots, { recursive: true })
      execFileSync('pdftoppm', ['-png', '-r', '70', '-f', '1', '-l', '2', pdf.file, join(shots, `shop-server-pdf-${paper}`)])
    })
  }

  it('a draft version\'s sheet says it is not approved', async () => {
    const graph = (await b.fab.get(`/api/circuits/${b.circuitId}/graph`)).body
    graph.document.circuit.notes = 'Draft after the approval.'
    const saved = await b.fab.put(`/api/circuits/${b.circuitId}/graph`, { baseVersion: graph.circuit.version, document: graph.document })
    expect(saved.status).toBe(200)
    const res = await getBytes(b.tech, `/api/circuits/${b.circuitId}/versions/${saved.body.version}/shop/build-sheet.pdf`)
    const text = readPdf(res.bytes).text.replace(/\s+/g, ' ')
    expect(text).toContain(`NOT APPROVED: version ${saved.body.version}`)
    expect(text).toContain(`Version ${b.version} is the approved one.`)
  })
})

describe('the approval e-mail', () => {
  it('reaches the submitter with the build sheet of the approved version attached as a PDF', async () => {
    const mail = await waitForMail(b.emails.fab, { subject: `Approved: ${b.circuitTitle}`, timeoutMs: 20_000 })
    expect(mail.text).toContain('The build sheet of this version is attached')
    expect(mail.attachments).toHaveLength(1)
    expect(mail.attachments[0]).toMatchObject({ contentType: 'application/pdf' })
    expect(mail.attachments[0]!.filename).toMatch(new RegExp(`-v${b.version}-build-sheet\\.pdf$`))
    expect(mail.attachments[0]!.size).toBeGreaterThan(20_000)
    const [row] = await sql`select attachments, status from mail_outbox where kind = 'review-approved' and to_address = ${b.emails.fab}`
    expect(row!.status).toBe('sent')
    expect(row!.attachments).toEqual([{ kind: 'build-sheet', ref: `${b.circuitId}:${b.version}`, filename: `build-sheet-v${b.version}.pdf` }])
  })
})
