/**
 * Downloads a file from an API route: fetched first, so a refusal (409, 413, …) shows its message
 * in place instead of replacing the page; then saved under the name the server gives.
 */
export function useDownload() {
  const error = ref('')
  const busy = ref(false)
  async function download(url: string, fallbackName: string) {
    error.value = ''
    busy.value = true
    try {
      const res = await $fetch.raw<Blob>(url, { responseType: 'blob' })
      const name = /filename="([^"]+)"/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? fallbackName
      const href = URL.createObjectURL(res._data!)
      const a = document.createElement('a')
      a.href = href
      a.download = name
      a.click()
      setTimeout(() => URL.revokeObjectURL(href), 1000)
    } catch (e) {
      error.value = await blobErrorMessage(e)
    } finally {
      busy.value = false
    }
  }
  return { error, busy, download }
}

/** The server's message of a refused download (the body arrives as a Blob). */
async function blobErrorMessage(e: unknown): Promise<string> {
  const data = (e as { data?: unknown }).data
  if (data instanceof Blob) {
    try {
      const body = JSON.parse(await data.text()) as { message?: string }
      if (body.message) return body.message
    } catch {
      // not JSON: fall through
    }
  }
  return apiErrorMessage(e)
}
