const WHEN = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' })

/** A moment as people read it on the page: "2 Dec 2026, 01:10 UTC". */
export function formatWhen(iso: string): string {
  return `${WHEN.format(new Date(iso))} UTC`
}
