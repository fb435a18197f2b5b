#!/usr/bin/env node
// Local stand-in for S3 (s3rver) for development and tests, on 127.0.0.1 only.
//   node scripts/fake-s3.mjs --dir DIR --bucket NAME [--bucket NAME2] [--port 4569] [--port-file FILE] [--parent PID]
// Takes the first free port from --port upwards, creates the buckets, writes the port it took to
// --port-file once it answers, and exits by itself when the process --parent is gone.
import { mkdirSync, writeFileSync } from 'node:fs'
import { createServer } from 'node:net'
import S3rver from 's3rver'

function parseArgs(argv) {
  const out = { dir: '', buckets: [], port: 4569, portFile: '', parent: 0 }
  for (let i = 0; i < argv.length; i++) {
    const value = argv[i + 1]
    switch (argv[i]) {
      case '--dir': out.dir = value; i++; break
      case '--bucket': out.buckets.push(value); i++; break
      case '--port': out.port = Number(value); i++; break
      case '--port-file': out.portFile = value; i++; break
      case '--parent': out.parent = Number(value); i++; break
      default: throw new Error(`unknown argument ${argv[i]}`)
    }
  }
  if (!out.dir || out.buckets.length === 0) throw new Error('usage: fake-s3.mjs --dir DIR --bucket NAME [--port N] [--port-file FILE] [--parent PID]')
  return out
}

function portIsFree(port) {
  return new Promise((resolve) => {
    const probe = createServer()
    probe.once('error', () => resolve(false))
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)))
  })
}

async function listen(options, firstPort) {
  for (let port = firstPort; port < firstPort + 100; port++) {
    if (!(await portIsFree(port))) continue
    const server = new S3rver({ ...options, port })
    try {
      await server.run()
      return { server, port }
    } catch (error) {
      // taken between the probe and the listen by another process: try the next one
      if (error.code !== 'EADDRINUSE') throw error
    }
  }
  throw new Error(`no free port from ${firstPort} to ${firstPort + 99}`)
}

const args = parseArgs(process.argv.slice(2))
mkdirSync(args.dir, { recursive: true })
const { server, port } = await listen({
  address: '127.0.0.1',
  directory: args.dir,
  silent: true,
  vhostBuckets: false,
  configureBuckets: args.buckets.map(name => ({ name })),
}, args.port)
if (args.portFile) writeFileSync(args.portFile, `${port}\n`)
console.log(`[fake-s3] http://127.0.0.1:${port} buckets ${args.buckets.join(', ')} in ${args.dir}`)

let closing = false
async function stop() {
  if (closing) return
  closing = true
  await server.close().catch(() => {})
  process.exit(0)
}
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
if (args.parent > 0) {
  // a parent killed with SIGKILL cannot run its trap; do not outlive it
  setInterval(() => {
    try { process.kill(args.parent, 0) } catch (error) { if (error.code === 'ESRCH') stop() }
  }, 2000).unref()
}
