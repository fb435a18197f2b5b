import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { baseUrl, goodPassword, uniqueEmail } from '../helpers/http'
import { hydrated, launchBrowser, newContext, shot } from '../helpers/browser'

let browser: Browser
beforeAll(async () => { browser = await launchBrowser() })
afterAll(async () => { await browser?.close() })

describe('a newcomer in the browser', () => {
  it('signs up, creates a project and a circuit, and finds them after a reload', async () => {
    const context = await newContext(browser, baseUrl)
    const page = await context.newPage()
    await page.goto('/')
    await page.waitForURL(/\/sign-in/)
    await hydrated(page)
    await shot(page, 'sign-in')

    await page.getByRole('link', { name: 'Create an account' }).click()
    await page.waitForURL(/\/sign-up/)
    await hydrated(page)
    // submitting empty shows the field messages, tied to the fields
    await page.getByRole('button', { name: 'Create account and workshop' }).click()
    await expect.poll(() => page.getByRole('alert').count()).toBeGreaterThanOrEqual(3)
    await page.getByLabel('Your name').fill('Nell Browser')
    await page.getByLabel('E-mail').fill(uniqueEmail('e2e'))
    await page.getByLabel('Password').fill(goodPassword)
    await page.getByLabel('Workshop name').fill('Browser Test Garage')
    await shot(page, 'sign-up')
    await page.getByRole('button', { name: 'Create account and workshop' }).click()

    await page.waitForURL(url => url.pathname === '/')
    await expect.poll(() => page.getByRole('heading', { name: 'Projects' }).isVisible()).toBe(true)
    await page.getByRole('button', { name: 'New project' }).click()
    await page.getByLabel('Build title').fill('Pickup with a diesel six')
    await page.getByLabel('Vehicle').fill('Long-bed pickup')
    await page.getByLabel('Engine').fill('Inline six turbo-diesel')
    await shot(page, 'project-new')
    await page.getByRole('button', { name: 'Create project' }).click()

    await page.waitForURL(/\/projects\//)
    await expect.poll(() => page.getByTestId('project-title').textContent()).toBe('Pickup with a diesel six')
    await page.getByLabel('Circuit title').fill('Engine cooling')
    await page.getByRole('button', { name: 'Add circuit' }).click()
    await page.waitForURL(/\/circuits\//)
    await expect.poll(() => page.getByTestId('circuit-title').textContent()).toBe('Engine cooling')

    await page.goto('/')
    await page.reload()
    await hydrated(page)
    const table = page.getByTestId('projects-table')
    await expect.poll(() => table.textContent()).toContain('Pickup with a diesel six')
    await shot(page, 'projects')
    await table.getByRole('link', { name: 'Pickup with a diesel six' }).click()
    await page.waitForURL(/\/projects\//)
    await page.reload()
    await expect.poll(() => page.getByTestId('circuit-list').textContent()).toContain('Engine cooling')
    await shot(page, 'project')

    await page.goto('/account')
    await hydrated(page)
    await shot(page, 'account')
    await page.goto('/members')
    await hydrated(page)
    await shot(page, 'members')
    await context.close()
  })

  it('signs in with the demo owner and sees the demo build', async () => {
    const context = await newContext(browser, baseUrl)
    const page = await context.newPage()
    await page.goto('/sign-in')
    await hydrated(page)
    await page.getByLabel('E-mail').fill('owner@quillfeather.test')
    await page.getByLabel('Password').fill('wrong-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.getByRole('alert').first().textContent()).toContain('e-mail or password is wrong')
    await page.getByLabel('Password').fill('hosewright-demo')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(url => url.pathname === '/')
    await expect.poll(() => page.getByTestId('projects-table').textContent()).toContain('Camper van turbo-four transplant')
    await context.close()
  })
})
