import { idSlug } from '#shared/circuit'
import { documentToSvg, type ViewName } from '#shared/drawing'
import type { EditorViews } from './useEditorViews'

function download(href: string, name: string) {
  const a = document.createElement('a')
  a.href = href
  a.download = name
  document.body.appendChild(a)
  a.click()
  a.remove()
}

/** Pictures and files of the circuit: PNG and SVG of each view, the exchange JSON, and import as a new circuit. */
export function useCircuitExport(views: EditorViews) {
  const store = useEditorStore()
  const api = useApi()
  const describe = useApiError()
  const importError = ref('')
  const importing = ref(false)
  const baseName = () => idSlug(store.document?.circuit.title ?? 'circuit', 'circuit').slice(0, 60)

  function png(view: ViewName) {
    const url = views.handles.get(view)?.toPng()
    if (url) download(url, `${baseName()}-${view}.png`)
  }

  function svg(view: ViewName) {
    const text = documentToSvg(store.rawDocument(), view, useDrawingTheme(), { report: store.report, flow: store.flowOverlay })
    const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }))
    download(url, `${baseName()}-${view}.svg`)
    setTimeout(() => URL.revokeObjectURL(url), 10_000)
  }

  const exchangeHref = computed(() => (store.circuitId ? `/api/circuits/${store.circuitId}/export` : undefined))

  /** Reads a .json exchange file and creates a new circuit from it in this project; opens it. */
  async function importFile(file: File) {
    importError.value = ''
    if (!store.projectId) { importError.value = 'This circuit’s project is not known; open it from the project page.'; return }
    importing.value = true
    try {
      let document: unknown
      try {
        document = JSON.parse(await file.text())
      } catch {
        importError.value = `${file.name} is not a JSON file.`
        return
      }
      const created = await api<{ circuit: { id: string } }>(`/api/projects/${store.projectId}/circuits/import`, { method: 'POST', body: { document } })
      await navigateTo(`/circuits/${created.circuit.id}`)
    } catch (e) {
      const info = describe(e)
      const fields = Object.entries(info.fields).slice(0, 5).map(([k, v]) => `${k}: ${v}`)
      importError.value = [info.message, ...fields].join(' ')
    } finally {
      importing.value = false
    }
  }

  return { png, svg, exchangeHref, importFile, importError, importing }
}
