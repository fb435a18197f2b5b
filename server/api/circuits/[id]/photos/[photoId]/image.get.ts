// The photo as uploaded.
export default defineEventHandler(event => sendPhoto(event, 'image'))
