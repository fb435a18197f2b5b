import { revisionParams } from '#shared/schemas/circuitRecord'
import { buildSheetQuery } from '#shared/schemas/shop'

// The build sheet of a version as a PDF made on the server (A4 or Letter), the same as the printed page.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:read')
  const { id, version } = await paramsOf(event, revisionParams)
  const { paper } = await queryOf(event, buildSheetQuery)
  const view = await shopViewFor(useDb(), member.workshopId, id, version, false)
  const pdf = await buildSheetPdf(view, paper)
  setResponseHeader(event, 'content-type', 'application/pdf')
  setResponseHeader(event, 'content-disposition', `inline; filename="${buildSheetFilename(view)}"`)
  return pdf
})
