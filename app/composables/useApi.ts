export interface ApiOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  body?: unknown
  query?: Record<string, unknown>
}
export type ApiFetch = <T = unknown>(url: string, options?: ApiOptions) => Promise<T>

/**
 * $fetch that forwards the browser's cookies during server-side rendering, so pages rendered on
 * the server see the same session as the browser. Typed loosely on purpose: Nitro's typed-route
 * inference on a union of fetchers exceeds the compiler's depth limit.
 */
export function useApi(): ApiFetch {
  if (import.meta.server) return useRequestFetch() as unknown as ApiFetch
  return $fetch as unknown as ApiFetch
}
