// Sign out: the server-side session row is revoked, so a copied cookie stops working too.
export default defineEventHandler(async (event) => {
  await endSession(event)
  return { ok: true }
})
