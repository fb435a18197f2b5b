import type { Ref } from 'vue'

/** A copy of `source` that follows it only after `ms` of quiet (for search boxes). */
export function useDebouncedRef<T>(source: Ref<T>, ms: number): Readonly<Ref<T>> {
  const out = ref(source.value) as Ref<T>
  let timer: ReturnType<typeof setTimeout> | undefined
  watch(source, (v) => {
    clearTimeout(timer)
    timer = setTimeout(() => { out.value = v }, ms)
  })
  return readonly(out) as Readonly<Ref<T>>
}
