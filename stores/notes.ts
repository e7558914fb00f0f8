import { acceptHMRUpdate, defineStore } from 'pinia'
import type { NoteAttachmentDto, NoteDto, NoteThreadDto } from '#shared/types/notes'

/**
 * The notes of the open study: the threads, what the composer is anchored to (a marker in the
 * comparison sets it), and the writes. Every write reloads the threads, so the list is the server's.
 */
export const useNotesStore = defineStore('notes', () => {
  const studyId = ref<number | null>(null)
  const threads = ref<NoteThreadDto[]>([])
  const anchor = ref<NoteAnchorInput>({ type: 'study' })
  const error = ref('')
  /** bumps when a marker asks the panel to bring the composer into view */
  const focusRequest = ref(0)

  async function load(id: number, fetcher: (url: string) => Promise<unknown> = $fetch as (url: string) => Promise<unknown>) {
    studyId.value = id
    threads.value = await fetcher(`/api/studies/${id}/notes`) as NoteThreadDto[]
  }
  const reload = () => (studyId.value ? load(studyId.value) : Promise.resolve())

  /** Open threads per candidate and per candidate + metric (the comparison's markers). */
  const openCounts = computed(() => {
    const counts = new Map<string, number>()
    for (const t of threads.value) {
      if (t.resolved || t.deleted || !t.anchor.candidateId) continue
      const key = noteAnchorKey(t.anchor.candidateId, t.anchor.metricKey)
      counts.set(key, (counts.get(key) ?? 0) + 1)
    }
    return counts
  })

  function aim(next: NoteAnchorInput) {
    anchor.value = next
    focusRequest.value += 1
  }

  async function run<T>(work: () => Promise<T>): Promise<T | undefined> {
    error.value = ''
    try {
      const out = await work()
      await reload()
      return out
    } catch (e) {
      error.value = apiErrorMessage(e)
      return undefined
    }
  }

  /** Writes a note (a thread, or a reply when parentId is given) and uploads its files after it. */
  async function write(body: string, files: File[] = [], parentId?: number) {
    return run(async () => {
      const payload = parentId ? { body, parentId } : { body, anchor: anchor.value }
      const note = await $fetch<NoteDto>(`/api/studies/${studyId.value}/notes`, { method: 'POST', body: payload })
      for (const file of files) await upload(note.id, file)
      return note
    })
  }

  function upload(noteId: number, file: File) {
    const form = new FormData()
    form.append('file', file, file.name)
    return $fetch<NoteAttachmentDto>(`/api/notes/${noteId}/attachments`, { method: 'POST', body: form })
  }

  const edit = (note: NoteDto, body: string) => run(() => $fetch<NoteDto>(`/api/notes/${note.id}`, { method: 'PATCH', body: { version: note.version, body } }))
  const remove = (note: NoteDto) => run(() => $fetch<null>(`/api/notes/${note.id}`, { method: 'DELETE' }))
  const setResolved = (note: NoteDto, resolved: boolean) => run(() => $fetch<NoteDto>(`/api/notes/${note.id}/${resolved ? 'resolve' : 'reopen'}`, { method: 'POST' }))
  const attach = (note: NoteDto, file: File) => run(() => upload(note.id, file))

  return { studyId, threads, anchor, error, focusRequest, openCounts, load, reload, aim, write, edit, remove, setResolved, attach }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useNotesStore, import.meta.hot))
