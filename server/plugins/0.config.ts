import { checkConfig, describeConfigProblems } from '../utils/config'
import { captureConsole, writeLog } from '../utils/log'

// First plugin of the app (plugins run in file-name order): every console line becomes a JSON log
// line, then the environment is checked. A bad setting stops the server before it listens, with
// exit code 78 (EX_CONFIG in BSD's sysexits.h) and one line per bad variable on stderr.
export const CONFIG_EXIT_CODE = 78

export default defineNitroPlugin(() => {
  captureConsole()
  const result = checkConfig()
  if (result.ok) return
  process.stderr.write(`${describeConfigProblems(result.problems)}\n`)
  writeLog('fatal', 'invalid configuration', { problems: result.problems })
  process.exit(CONFIG_EXIT_CODE)
})
