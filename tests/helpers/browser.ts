// Debian's Chromium driven by playwright-core, with every outside connection switched off.
// playwright gives each launch a fresh temporary profile of its own.
import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'

export const screenshotDir = resolve(import.meta.dirname, '../screenshots')

export async function launchBrowser(): Promise<Browser> {
  return await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage',
      '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE localhost, EXCLUDE 127.0.0.1',
    ],
  })
}

export async function newContext(browser: Browser, baseURL: string): Promise<BrowserContext> {
  return await browser.newContext({ baseURL, viewport: { width: 1280, height: 860 }, locale: 'en-GB' })
}

/** Saves a full-page screenshot for people to look at (the folder is git-ignored). */
export async function shot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true })
  await page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true })
}

/** Waits until Nuxt has hydrated the page, so clicks reach Vue handlers rather than bare HTML. */
export async function hydrated(page: Page) {
  await page.waitForFunction(() => {
    const app = (window as unknown as { useNuxtApp?: () => { isHydrating?: boolean } })
    const el = document.querySelector('#__nuxt') as (Element & { __vue_app__?: unknown }) | null
    return Boolean(el?.__vue_app__) && !(app.useNuxtApp?.().isHydrating)
  })
}
