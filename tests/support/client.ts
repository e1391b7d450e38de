import type { RefusalData } from '../../shared/utils/errors'
/** A small HTTP client with its own cookie jar: one per signed-in person in a test. */
export class ApiClient {
  constructor(readonly baseUrl: string, readonly headers: Record<string, string> = {}, private cookies = new Map<string, string>()) {}

  /** The same person (the same cookie jar) talking to another address, e.g. another app replica. */
  on(baseUrl: string) {
    return new ApiClient(baseUrl, this.headers, this.cookies)
  }

  async request<T = unknown>(method: string, path: string, body?: unknown, init: { raw?: string, headers?: Record<string, string> } = {}) {
    const headers: Record<string, string> = { accept: 'application/json', ...this.headers, ...init.headers }
    if (body !== undefined || init.raw !== undefined) headers['content-type'] = 'application/json'
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ')
    const response = await fetch(new URL(path, this.baseUrl), {
      method,
      headers,
      body: init.raw ?? (body === undefined ? undefined : JSON.stringify(body)),
      redirect: 'manual',
    })
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(';')
      const index = pair!.indexOf('=')
      const name = pair!.slice(0, index)
      const value = pair!.slice(index + 1)
      if (value === '' || /max-age=0/i.test(cookie)) this.cookies.delete(name)
      else this.cookies.set(name, value)
    }
    const text = await response.text()
    let data: unknown = text
    try {
      data = text ? JSON.parse(text) : null
    }
    catch {
      // not JSON: keep the text
    }
    return { status: response.status, headers: response.headers, data: data as T, text }
  }

  /** The Cookie header this client sends. */
  cookieHeader() {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ')
  }

  /** A second client carrying this one's cookies now: a copied cookie, as a thief or another tab would hold it. */
  copy() {
    const twin = new ApiClient(this.baseUrl, this.headers)
    for (const [name, value] of this.cookies) twin.cookies.set(name, value)
    return twin
  }

  get<T = unknown>(path: string) { return this.request<T>('GET', path) }
  post<T = unknown>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  put<T = unknown>(path: string, body?: unknown) { return this.request<T>('PUT', path, body) }
  patch<T = unknown>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body) }
  delete<T = unknown>(path: string) { return this.request<T>('DELETE', path) }
}

let counter = 0
export function uniqueEmail(prefix = 'person') {
  counter += 1
  return `${prefix}.${Date.now().toString(36)}${counter}@example.test`
}

export interface FieldError { statusCode: number, message: string, data?: RefusalData }
