import { inject } from 'vitest'

export const DEMO_PASSWORD = 'harrow-lake-demo'
export const DEMO = {
  admin: 'admin@harrowlake.example',
  architect: 'architect@harrowlake.example',
  engineer: 'engineer@harrowlake.example',
  manager: 'manager@harrowlake.example'
} as const

export interface ApiResponse<T = unknown> { status: number, body: T, headers: Headers }

/** A request to the test app server; `cookie` is the session cookie from signIn; a FormData body goes as multipart. */
export async function api<T = unknown>(path: string, init: { method?: string, body?: unknown, cookie?: string, headers?: Record<string, string> } = {}): Promise<ApiResponse<T>> {
  const headers: Record<string, string> = { accept: 'application/json', ...init.headers }
  const multipart = init.body instanceof FormData
  if (init.body !== undefined && !multipart) headers['content-type'] = 'application/json'
  if (init.cookie) headers.cookie = init.cookie
  const res = await fetch(`${inject('baseUrl')}${path}`, {
    method: init.method ?? 'GET',
    headers,
    body: init.body === undefined ? undefined : multipart || typeof init.body === 'string' ? init.body as BodyInit : JSON.stringify(init.body),
    redirect: 'manual'
  })
  const text = await res.text()
  let body: unknown = text
  try {
    body = JSON.parse(text)
  } catch {
    // not JSON: keep the text
  }
  return { status: res.status, body: body as T, headers: res.headers }
}

/** Signs in and returns the httpOnly session cookie ("rw_session=…"). */
export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await api('/api/auth/login', { method: 'POST', body: { email, password } })
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed with ${res.status}`)
  const cookie = res.headers.getSetCookie().find(c => c.startsWith('rw_session='))
  if (!cookie) throw new Error('no session cookie set')
  return cookie.split(';')[0]!
}
