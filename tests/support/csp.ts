import type { Page } from 'playwright-core'

/**
 * Records Content-Security-Policy violations of a page (the `securitypolicyviolation` event, from
 * before any page script runs) and console errors and page errors that mention the policy.
 */
export async function watchCsp(page: Page): Promise<() => Promise<string[]>> {
  const console: string[] = []
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy|Refused to/i.test(m.text())) console.push(m.text())
  })
  page.on('pageerror', (e) => {
    if (/Content Security Policy|Refused to/i.test(e.message)) console.push(e.message)
  })
  await page.addInitScript(() => {
    const seen: string[] = []
    ;(window as unknown as { __csp: string[] }).__csp = seen
    document.addEventListener('securitypolicyviolation', e => seen.push(`${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}`))
  })
  return async () => [...console, ...await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? [])]
}
