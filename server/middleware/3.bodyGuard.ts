import type { H3Event } from 'h3'

// Request bodies, before any route reads them:
//  - size caps for every method that carries one: JSON up to HOSEWRIGHT_JSON_MAX_MB (20 MB, room
//    for very large circuit saves), multipart up to HOSEWRIGHT_UPLOAD_MAX_MB (12 MB, room for a
//    10 MB photo and its form); a declared length over the cap is refused before a byte is read, a
//    chunked body is counted as it arrives;
//  - JSON text may not carry the NUL character (\u0000): PostgreSQL text cannot store it, so it
//    would end as a server error deep in a query. It is refused here with 400.
// JSON bodies are read once here; h3 keeps them for the route's own readBody.
const MB = 1024 * 1024
const JSON_TYPE = /^application\/(json|[a-z0-9.+-]+\+json)$/
// \u0000 not itself escaped (an even number of backslashes before it, or none)
const ESCAPED_NUL = /(?<!\\)(?:\\\\)*\\u0000/i

function tooLarge(limit: number): Error {
  return createError({
    statusCode: 413, statusMessage: 'Payload too large',
    message: `The request is larger than ${Math.round(limit / MB)} MB and was not read.`,
  })
}

function readCapped(event: H3Event, limit: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const req = event.node.req
    const chunks: Buffer[] = []
    let total = 0
    const onData = (chunk: Buffer) => {
      total += chunk.length
      if (total <= limit) return void chunks.push(chunk)
      req.off('data', onData)
      req.resume() // drain the rest so the 413 still reaches the client
      reject(tooLarge(limit))
    }
    req.on('data', onData).once('end', () => resolve(Buffer.concat(chunks))).once('error', reject)
  })
}

export default defineEventHandler(async (event) => {
  if (event.method === 'GET' || event.method === 'HEAD' || event.method === 'OPTIONS') return
  const { jsonBytes, multipartBytes } = bodyLimits()
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  const multipart = type.startsWith('multipart/')
  const limit = multipart ? multipartBytes : jsonBytes
  const declared = getRequestHeader(event, 'content-length')
  if (declared !== undefined && Number(declared) > limit) throw tooLarge(limit)
  // the photo route streams its own multipart body with a tighter cap
  if (multipart) return
  const chunked = declared === undefined && getRequestHeader(event, 'transfer-encoding') !== undefined
  let body: Buffer | undefined
  if (chunked) {
    body = await readCapped(event, limit)
    // h3's body readers take a body that was already read from here
    ;(event as unknown as { _requestBody?: Buffer })._requestBody = body
  } else if (JSON_TYPE.test(type) && Number(declared) > 0) {
    body = await readRawBody(event, false) ?? undefined
  }
  if (body && JSON_TYPE.test(type) && ESCAPED_NUL.test(body.toString('utf8'))) {
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: 'Text may not contain the NUL character (\\u0000).' })
  }
})
