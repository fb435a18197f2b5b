// The photo's small WebP, for lists and the inspector strip.
export default defineEventHandler(event => sendPhoto(event, 'thumbnail'))
