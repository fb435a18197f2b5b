// Prints the demo sign-ins for `npm start`.
import { demoAccounts, demoPassword } from '../server/database/demo'

const width = Math.max(...demoAccounts.map(a => a.email.length))
console.log('Demo sign-ins (password for all: %s)', demoPassword)
for (const a of demoAccounts) console.log('  %s  %s', a.email.padEnd(width), a.role)
