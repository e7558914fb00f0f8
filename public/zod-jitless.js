// zod 4 probes whether it may compile parsers with `new Function` on its first object parse, which
// can happen while the app's modules load; the Content-Security-Policy refuses eval and reports the
// probe as a violation. This runs before any module (a blocking script in <head>) and tells zod not
// to try: same results, the interpreted path.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true })
