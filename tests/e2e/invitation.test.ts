import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { Client, baseUrl, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { linkFrom, waitForMail } from '../helpers/mail'
import { hydrated, launchBrowser, newContext, shot } from '../helpers/browser'
import { sql } from '../helpers/db'

// An owner invites a reviewer in the browser; the link comes out of the e-mail the fake SMTP
// server received, and a fresh browser (nobody signed in) follows it.

let browser: Browser
beforeAll(async () => { browser = await launchBrowser() })
afterAll(async () => {
  await browser?.close()
  await sql.end()
})

describe('joining a workshop by invitation', () => {
  it('the owner invites, the invitee follows the mailed link, signs up and sees the projects', async () => {
    const owner = await signUp('e2e-inviter', 'Tallow Bend Fabrication')
    await owner.client.post('/api/projects', { title: 'Shooting brake with a flat-six' })
    const ownerContext = await newContext(browser, baseUrl)
    const ownerPage = await ownerContext.newPage()
    await ownerPage.goto('/sign-in')
    await hydrated(ownerPage)
    await ownerPage.getByLabel('E-mail').fill(owner.email)
    await ownerPage.getByLabel('Password').fill(goodPassword)
    await ownerPage.getByRole('button', { name: 'Sign in' }).click()
    await ownerPage.waitForURL(url => url.pathname === '/')

    await ownerPage.goto('/members')
    await hydrated(ownerPage)
    const invitee = uniqueEmail('e2e-reviewer')
    const form = ownerPage.getByRole('form', { name: 'Invite a member' })
    await form.getByLabel('E-mail').fill(invitee)
    await form.getByLabel('Name (a suggestion for a new account)').fill('Wren Tallow')
    await form.getByLabel('Role').selectOption('reviewer')
    await form.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => ownerPage.getByTestId('invited-notice').textContent()).toContain(invitee)
    const row = ownerPage.getByTestId('invitations-table').getByRole('row', { name: new RegExp(invitee) })
    await expect.poll(() => row.getByTestId('mail-status').textContent(), { timeout: 15_000 }).toContain('Sent')
    await shot(ownerPage, 'invite-members')

    const mail = await waitForMail(invitee, { subject: 'Join Tallow Bend Fabrication' })
    const link = linkFrom(mail, '/invite/')

    const guestContext = await newContext(browser, baseUrl)
    const guest = await guestContext.newPage()
    await guest.goto(link.pathname)
    await hydrated(guest)
    expect(await guest.getByTestId('invitation-workshop').textContent()).toBe('Tallow Bend Fabrication')
    expect(await guest.getByTestId('invitation-role').textContent()).toBe('Reviewer')
    expect(await guest.getByLabel('Your name').inputValue()).toBe('Wren Tallow')
    await guest.getByLabel('Choose a password').fill('short')
    await guest.getByRole('button', { name: /Create account and join/ }).click()
    await expect.poll(() => guest.getByRole('alert').first().textContent()).toContain('at least 10')
    await guest.getByLabel('Choose a password').fill(goodPassword)
    await shot(guest, 'invite-accept')
    await guest.getByRole('button', { name: /Create account and join/ }).click()

    await guest.waitForURL(url => url.pathname === '/')
    await expect.poll(() => guest.getByTestId('projects-table').textContent()).toContain('Shooting brake with a flat-six')
    // a reviewer reads but does not start projects
    expect(await guest.getByRole('button', { name: 'New project' }).count()).toBe(0)
    await shot(guest, 'invite-joined')

    // the same link a second time: a clear page, and the HTTP status says so too
    const secondContext = await newContext(browser, baseUrl)
    const second = await secondContext.newPage()
    const response = await second.goto(link.pathname)
    expect(response?.status()).toBe(410)
    expect(await second.getByTestId('invitation-problem').textContent()).toContain('already been used')
    await shot(second, 'invite-used')

    // the outbox page: a mail that gave up after its attempts, sent again from the browser
    const stuck = uniqueEmail('e2e-undelivered')
    await sql`insert into mail_outbox (workshop_id, kind, to_address, subject, text_body, status, attempts, last_error)
      values (${owner.summary.workshop.id}, 'invitation', ${stuck}, 'Join Tallow Bend Fabrication on Hosewright',
              'A mail the server refused.', 'failed', 8, 'Message failed: 451 Temporary failure for testing')`
    await ownerPage.goto('/outbox')
    await hydrated(ownerPage)
    await expect.poll(() => ownerPage.getByTestId('outbox-list').textContent()).toContain(invitee)
    const stuckCard = ownerPage.getByTestId('outbox-mail').filter({ hasText: stuck })
    expect(await stuckCard.getByTestId('outbox-error').textContent()).toContain('451')
    await ownerPage.getByTestId('outbox-mail').filter({ hasText: invitee }).getByText('Message text').click()
    await shot(ownerPage, 'invite-outbox')
    await stuckCard.getByRole('button', { name: 'Send again now' }).click()
    await waitForMail(stuck)
    await expect.poll(() => stuckCard.getByTestId('mail-status').textContent(), { timeout: 10_000 }).toContain('Sent')
    expect(await stuckCard.getByTestId('outbox-attempts').textContent()).toBe('9')
    await Promise.all([ownerContext.close(), guestContext.close(), secondContext.close()])
  })

  it('an invitation for another address tells the signed-in person so', async () => {
    const owner = await signUp('e2e-mixup', 'Copperleaf Works')
    const invitee = uniqueEmail('e2e-meant')
    expect((await owner.client.post('/api/members', { email: invitee, role: 'technician' })).status).toBe(201)
    const link = linkFrom(await waitForMail(invitee), '/invite/')
    const bystander = await signUp('e2e-bystander', 'Own Garage')
    const context = await newContext(browser, baseUrl)
    await context.addCookies([...bystander.client.cookies].map(([name, value]) => ({ name, value, url: baseUrl })))
    const page = await context.newPage()
    await page.goto(link.pathname)
    await hydrated(page)
    const notice = page.getByTestId('invitation-other-account')
    expect(await notice.textContent()).toContain(invitee)
    expect(await notice.textContent()).toContain(bystander.email)
    await shot(page, 'invite-other-account')
    // signing out turns the page into the sign-up form for the invited address
    await notice.getByRole('button', { name: 'Sign out' }).click()
    await expect.poll(() => page.getByTestId('invite-email').textContent()).toBe(invitee)
    await context.close()
  })

  it('the forgot-password link leads to a reset page that sets a new password', async () => {
    const { email } = await signUp('e2e-forgetful')
    const context = await newContext(browser, baseUrl)
    const page = await context.newPage()
    await page.goto('/sign-in')
    await hydrated(page)
    await page.getByRole('link', { name: 'Forgot your password?' }).click()
    await page.waitForURL(/\/forgot-password/)
    await hydrated(page)
    await shot(page, 'invite-forgot-password')
    // the request itself goes through the API from its own client address: the browser's
    // address is shared by every run and would wear down the per-address limit
    const requested = await new Client(`10.252.${Math.floor(Math.random() * 250)}.1`).post('/api/password-resets', { email })
    expect(requested.status).toBe(202)
    const link = linkFrom(await waitForMail(email, { subject: 'Reset' }), '/reset-password/')
    await page.goto(link.pathname)
    await hydrated(page)
    await page.getByLabel('New password').fill('fresh-reset-password-4')
    await page.getByRole('button', { name: 'Save the new password' }).click()
    await expect.poll(() => page.getByTestId('reset-done').textContent()).toContain('Password changed')
    await shot(page, 'invite-reset-done')
    await page.getByRole('link', { name: 'Sign in' }).click()
    await page.waitForURL(/\/sign-in/)
    await hydrated(page)
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill('fresh-reset-password-4')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(url => url.pathname === '/')
    await context.close()
  })
})
