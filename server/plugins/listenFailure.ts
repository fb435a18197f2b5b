import { writeLog } from '../utils/log'

// A server that cannot listen (port taken, no permission) must stop with an error, not linger
// without serving: Nitro's own trap only logs uncaught errors, and a supervisor or script waiting
// for the health route would never learn why. Exit code 1, the reason on stderr and in the log.
export default defineNitroPlugin(() => {
  process.on('uncaughtException', (error: NodeJS.ErrnoException & { address?: string; port?: number }) => {
    if (error.syscall !== 'listen') return
    const where = `${error.address ?? ''}:${error.port ?? ''}`
    process.stderr.write(`Hosewright cannot listen on ${where}: ${error.code === 'EADDRINUSE' ? 'the address is already in use' : error.message} (${error.code})\n`)
    writeLog('fatal', 'cannot listen', { code: error.code, address: error.address, port: error.port })
    process.exit(1)
  })
})
