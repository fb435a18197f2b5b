import { z } from 'zod'
import { analyzeCircuit } from '#shared/engine'

// Analyse a document without saving it: the same report as the CLI and the saved graph.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const body = await bodyOf(event, z.unknown())
  return analyzeCircuit(documentOrFail(body, ''))
})
