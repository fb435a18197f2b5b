import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { addMember, Client, signUp, uniqueEmail } from '../helpers/http'
import { failNextDeliveries, mailApiUrl, mailTo, waitForMail } from '../helpers/mail'
import { sql } from '../helpers/db'

// The outbox: every mail is a row written with the action that caused it; the worker delivers it
// to the fake SMTP server, which can be told to refuse (451) the next N deliveries.

const maxAttempts = Number(process.env.HOSEWRIGHT_MAIL_MAX_ATTEMPTS ?? 8)

afterAll(async () => {
  await failNextDeliveries(0)
  await sql.end()
})

/** Waits until nothing is being sent or about to be (other suites' mail included), so a failure
 *  set on the fake hits the mail of this test. A `sending` row's next_attempt_at is its lease end. */
async function queueSettled() {
  await expect.poll(async () => (await sql`select count(*)::int as n from mail_outbox
    where status = 'sending' or (status = 'pending' and next_attempt_at <= now() + interval '5 seconds')`)[0]!.n, { timeout: 15_000 }).toBe(0)
}

async function outboxRow(email: string) {
  const [row] = await sql`select * from mail_outbox where to_address = ${email} order by created_at desc limit 1`
  return row
}

beforeEach(async () => {
  await failNextDeliveries(0)
  await queueSettled()
})

describe('mail outbox', () => {
  it('a refused delivery is tried again: attempts and the error are kept, then it arrives once', async () => {
    const { client: owner } = await signUp('retry-owner')
    const email = uniqueEmail('retried')
    await failNextDeliveries(2)
    expect((await owner.post('/api/members', { email, role: 'technician' })).status).toBe(201)
    await waitForMail(email, { timeoutMs: 20_000 })
    await expect.poll(async () => (await outboxRow(email))?.status).toBe('sent')
    const row = await outboxRow(email)
    expect(row!.attempts).toBe(3)
    expect(row!.last_error).toMatch(/451/)
    expect(row!.sent_at).not.toBeNull()
    expect(await mailTo(email)).toHaveLength(1)

    const listed = (await owner.get('/api/outbox')).body.find((m: any) => m.to === email)
    expect(listed).toMatchObject({ status: 'sent', attempts: 3, kind: 'invitation' })
    expect(listed.lastError).toMatch(/451/)
    expect(listed.text).toContain('/invite/')
    // the members page sees the same progress
    const invitation = (await owner.get('/api/invitations')).body.invitations.find((i: any) => i.email === email)
    expect(invitation.mail).toMatchObject({ status: 'sent', attempts: 3 })
  })

  it('while the mail server refuses, the action still happens; after the last attempt "send again" delivers', async () => {
    const { client: owner, summary } = await signUp('outage-owner')
    const email = uniqueEmail('during-outage')
    await failNextDeliveries(1000)
    expect((await owner.post('/api/members', { email, role: 'reviewer' })).status).toBe(201)
    // the invitation exists and its mail is queued with the error, whatever the mail server does
    const [invitation] = await sql`select i.id, i.mail_id from invitations i where i.email = ${email} and i.workshop_id = ${summary.workshop.id}`
    expect(invitation!.mail_id).toBeTruthy()
    await expect.poll(async () => {
      const row = await outboxRow(email)
      return row && row.attempts >= 1 && ['pending', 'sending', 'failed'].includes(row.status) && /451/.test(row.last_error ?? '')
    }).toBe(true)
    await expect.poll(async () => (await outboxRow(email))!.status, { timeout: 25_000 }).toBe('failed')
    const failed = await outboxRow(email)
    expect(failed!.attempts).toBe(maxAttempts)
    expect(await mailTo(email)).toHaveLength(0)

    await failNextDeliveries(0)
    const again = await owner.post(`/api/outbox/${failed!.id}/retry`)
    expect(again.status).toBe(200)
    await waitForMail(email)
    await expect.poll(async () => (await outboxRow(email))!.status).toBe('sent')
    expect((await outboxRow(email))!.attempts).toBe(maxAttempts + 1)
    // a sent mail is not sent again
    expect((await owner.post(`/api/outbox/${failed!.id}/retry`)).status).toBe(404)
  }, 60_000)

  it('a mail left "sending" by a stopped process goes out once its lease has run out', async () => {
    const { summary } = await signUp('lease-owner')
    const email = uniqueEmail('interrupted')
    await sql`insert into mail_outbox (workshop_id, kind, to_address, subject, text_body, status, attempts, next_attempt_at)
      values (${summary.workshop.id}, 'test', ${email}, 'Interrupted mail', 'Sent after a crash.', 'sending', 1, now() - interval '1 second')`
    const mail = await waitForMail(email)
    expect(mail.subject).toBe('Interrupted mail')
    await expect.poll(async () => (await outboxRow(email))!.status).toBe('sent')
    expect((await outboxRow(email))!.attempts).toBe(2)
    // a lease that has not run out yet is left alone
    const held = uniqueEmail('still-held')
    await sql`insert into mail_outbox (workshop_id, kind, to_address, subject, text_body, status, attempts, next_attempt_at)
      values (${summary.workshop.id}, 'test', ${held}, 'Held mail', 'Another worker has it.', 'sending', 1, now() + interval '1 hour')`
    await new Promise(resolve => setTimeout(resolve, 1500))
    expect(await mailTo(held)).toHaveLength(0)
    expect((await outboxRow(held))!.status).toBe('sending')
    await sql`delete from mail_outbox where to_address = ${held}`
  })

  it('an attachment nobody can produce fails at once, with the reason on the row', async () => {
    const { summary } = await signUp('attachment-owner')
    const email = uniqueEmail('no-attachment')
    await sql`insert into mail_outbox (workshop_id, kind, to_address, subject, text_body, attachments)
      values (${summary.workshop.id}, 'test', ${email}, 'With a sheet', 'See the attachment.',
              ${sql.json([{ kind: 'unheard-of-kind', ref: 'x', filename: 'sheet.pdf' }])})`
    await expect.poll(async () => (await outboxRow(email))!.status).toBe('failed')
    const row = await outboxRow(email)
    expect(row!.attempts).toBe(1)
    expect(row!.last_error).toContain('unheard-of-kind')
    expect(await mailTo(email)).toHaveLength(0)
  })

  it('a second worker on the same database never sends a mail twice', async () => {
    const { summary } = await signUp('two-workers')
    // a second worker in this process, like another app instance, against the same fake server
    const smtpPort = Number(new URL(mailApiUrl()).port) - 1
    Object.assign(process.env, { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtpPort), SMTP_IGNORE_TLS: '1', HOSEWRIGHT_MAIL_POLL_MS: '20' })
    const { startMailWorker, stopMailWorker, mailWorkerCounts } = await import('../../server/mail/worker')
    startMailWorker(process.env.HOSEWRIGHT_TEST_DATABASE_URL!)
    try {
      const addresses = Array.from({ length: 30 }, (_, i) => uniqueEmail(`fan-out-${i}`))
      await sql`insert into mail_outbox ${sql(addresses.map(to => ({
        workshop_id: summary.workshop.id, kind: 'test', to_address: to, subject: 'Fan-out', text_body: 'One of many.',
      })))}`
      await expect.poll(async () => (await sql`select count(*)::int as n from mail_outbox where to_address in ${sql(addresses)} and status = 'sent'`)[0]!.n, { timeout: 20_000 }).toBe(30)
      const counts = await Promise.all(addresses.map(async a => (await mailTo(a)).length))
      expect(counts.every(n => n === 1)).toBe(true)
      const attempts = await sql`select attempts from mail_outbox where to_address in ${sql(addresses)}`
      expect(attempts.every(r => r.attempts === 1)).toBe(true)
      expect(mailWorkerCounts.delivered).toBeGreaterThan(0)
    } finally {
      await stopMailWorker()
    }
  })

  it('is for owners only', async () => {
    const { client: owner } = await signUp('outbox-guard')
    const fab = await addMember(owner, 'fabricator')
    expect((await fab.client.get('/api/outbox')).status).toBe(403)
    const [row] = await sql`select id from mail_outbox where to_address = ${fab.email}`
    expect((await fab.client.post(`/api/outbox/${row!.id}/retry`)).status).toBe(403)
    expect((await (await signUp('outbox-stranger')).client.post(`/api/outbox/${row!.id}/retry`)).status).toBe(404)
    expect((await new Client().get('/api/outbox')).status).toBe(401)
  })
})
