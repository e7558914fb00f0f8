import { computePreview } from './preview'
import type { PreviewReply, PreviewRequest } from './preview'

// The worker's global scope, typed by what this file uses (the app's DOM lib has no worker scope).
const scope = self as unknown as {
  onmessage: ((event: MessageEvent<PreviewRequest>) => void) | null
  postMessage: (reply: PreviewReply) => void
}

// The analytic engine off the main thread, so typing stays responsive on 16-bit specs.
scope.onmessage = async (event) => {
  const { seq, raw, packs } = event.data
  const answer = await computePreview(raw, packs ?? [])
  scope.postMessage({ seq, ...answer })
}
