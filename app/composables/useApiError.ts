export interface ApiErrorInfo {
  status: number | null
  message: string
  fields: Record<string, string>
}

/** Turns a failed $fetch into a message and per-field messages for forms. */
export function useApiError() {
  return function describe(error: unknown): ApiErrorInfo {
    const e = error as { statusCode?: number; status?: number; data?: { message?: string; statusMessage?: string; data?: { fields?: Record<string, string> } } }
    const status = e?.statusCode ?? e?.status ?? null
    const fields = e?.data?.data?.fields ?? {}
    let message = e?.data?.message || e?.data?.statusMessage || ''
    if (!status) message = 'Cannot reach the server. Your input is kept; try again when the connection is back.'
    else if (status >= 500) message = 'The server had a problem. Your input is kept; try again.'
    return { status, message: message || 'Something went wrong.', fields }
  }
}
