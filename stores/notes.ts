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

  /**
   * Writes a note (a thread, or a reply when parentId is given) and uploads its files after it. A
   * refused file does not undo the note: the note is kept and the error names the file.
   */
  async function write(body: string, files: File[] = [], parentId?: number) {
    const refused: string[] = []
    const note = await run(async () => {
      const payload = parentId ? { body, parentId } : { body, anchor: anchor.value }
      const saved = await $fetch<NoteDto>(`/api/studies/${studyId.value}/notes`, { method: 'POST', body: payload })
      for (const file of files) {
        try {
          await upload(saved.id, file)
        } catch (e) {
          refused.push(`${file.name}: ${apiErrorMessage(e)}`)
        }
      }
      return saved
    })
    if (note && refused.length) error.value = `The note was saved, but not every file: ${refused.join('; ')}`
    return note
  }

  function upload(noteId: number, file: File) {
    const form = new FormData()
    form.append('file', file, file.name)
    return $fetch<NoteAttachmentDto>(`/api/notes/${noteId}/attachments`, { method: 'POST', body: form })
  }

  const edit = (note: NoteDto, body: string) => run(() => $fetch<NoteDto>(`/api/notes/${note.id}`, { method: 'PATCH', body: { version: note.version, body } }))
  const remove = (note: NoteDto) => run(() => $fetch<null>(`/api/notes/${note.id}`, { method: 'DELETE' }))
  const setResolved = (note: NoteDto, resolved: boolean) => run(() => $fetch<NoteDto>(`/api/notes/${note.id}/${resolved ? 'resolve' : 'reopen'}`, { method: 'POST' }))

  return { studyId, threads, anchor, error, focusRequest, openCounts, load, reload, aim, write, edit, remove, setResolved }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useNotesStore, import.meta.hot))
