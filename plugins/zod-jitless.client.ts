import { z } from 'zod'

/**
 * zod 4 probes whether it may compile parsers with `new Function` on the first object parse; the
 * Content-Security-Policy refuses eval, so the probe itself is reported as a violation. Tell zod up
 * front not to try (same results, the interpreted path).
 */
export default defineNuxtPlugin({
  name: 'zod-jitless',
  enforce: 'pre',
  setup() {
    z.config({ jitless: true })
  }
})
