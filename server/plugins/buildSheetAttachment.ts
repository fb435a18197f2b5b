import { PermanentMailError, registerAttachmentResolver } from '../utils/mailer'
import { buildSheetFilename, buildSheetPdf } from '../utils/buildSheetPdf'
import { shopViewFor } from '../utils/shopView'

// The approval e-mail carries the build sheet of the approved version: attachment kind
// 'build-sheet', ref "<circuit id>:<version>", made at send time from the frozen version.
const REF = /^([0-9a-f-]{36}):(\d{1,10})$/i

export default defineNitroPlugin(() => {
  registerAttachmentResolver('build-sheet', async (attachment, mail) => {
    const m = REF.exec(attachment.ref)
    if (!m || !mail.workshopId) throw new PermanentMailError(`build-sheet attachment: bad reference "${attachment.ref}"`)
    let view
    try {
      view = await shopViewFor(useDb(), mail.workshopId, m[1]!, Number(m[2]), false)
    } catch (error) {
      // the circuit or version is gone (404): no retry can bring it back; anything else may pass
      if ((error as { statusCode?: number }).statusCode === 404) throw new PermanentMailError(`build-sheet attachment: ${attachment.ref} no longer exists`)
      throw error
    }
    return { content: await buildSheetPdf(view, 'a4'), contentType: 'application/pdf', filename: buildSheetFilename(view) }
  })
})
