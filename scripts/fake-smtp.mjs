// A loopback SMTP server that receives everything the app sends in development and tests.
// Messages are parsed and kept as JSON files; a small HTTP API lists them for tests and people:
//   GET    /messages[?to=address]   newest last
//   DELETE /messages                forget all
//   POST   /fail?count=N            answer the next N messages with a temporary failure (451)
// Usage: node scripts/fake-smtp.mjs <smtpPort> <httpPort> <dir>
import { createServer } from 'node:http'
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'

const [smtpPort, httpPort, dir] = [Number(process.argv[2] ?? 2525), Number(process.argv[3] ?? 2526), process.argv[4] ?? '.data/mail']
mkdirSync(dir, { recursive: true })
let failNext = 0
let counter = 0

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  logger: false,
  banner: 'Hosewright development mail catcher',
  onData(stream, session, callback) {
    if (failNext > 0) {
      failNext--
      stream.resume()
      stream.on('end', () => { const e = new Error('Temporary failure for testing'); e.responseCode = 451; callback(e) })
      return
    }
    simpleParser(stream).then((mail) => {
      const record = {
        id: `${Date.now()}-${String(counter++).padStart(6, '0')}`,
        receivedAt: new Date().toISOString(),
        envelope: { from: session.envelope.mailFrom?.address ?? null, to: session.envelope.rcptTo.map(r => r.address) },
        from: mail.from?.text ?? null,
        to: mail.to ? [].concat(mail.to).map(a => a.text).join(', ') : '',
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
        attachments: (mail.attachments ?? []).map(a => ({ filename: a.filename, contentType: a.contentType, size: a.size })),
      }
      writeFileSync(join(dir, `${record.id}.json`), JSON.stringify(record, null, 2))
      callback()
    }, callback)
  },
})

function list(to) {
  const all = readdirSync(dir).filter(f => f.endsWith('.json')).sort().map(f => JSON.parse(readFileSync(join(dir, f), 'utf8')))
  return to ? all.filter(m => m.envelope.to.some(a => a.toLowerCase() === to.toLowerCase())) : all
}

const http = createServer((req, res) => {
  const url = new URL(req.url, 'http://localhost')
  res.setHeader('content-type', 'application/json')
  if (req.method === 'GET' && url.pathname === '/messages') return res.end(JSON.stringify(list(url.searchParams.get('to'))))
  if (req.method === 'DELETE' && url.pathname === '/messages') {
    for (const f of readdirSync(dir)) rmSync(join(dir, f))
    return res.end('{"ok":true}')
  }
  if (req.method === 'POST' && url.pathname === '/fail') {
    failNext = Number(url.searchParams.get('count') ?? 1)
    return res.end(JSON.stringify({ failNext }))
  }
  res.statusCode = 404
  res.end('{"error":"not found"}')
})

smtp.listen(smtpPort, '127.0.0.1', () => {
  http.listen(httpPort, '127.0.0.1', () => console.log(`fake SMTP on 127.0.0.1:${smtpPort}, messages on http://127.0.0.1:${httpPort}/messages`))
})
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => { smtp.close(); http.close(); process.exit(0) })
