import tailwindConfig from '~~/tailwind.config'
import { drawingTheme, type DrawingTheme, type ThemeColours } from '#shared/drawing'

let theme: DrawingTheme | null = null

/** The drawing's colours, from the app's Tailwind theme so the canvas matches the rest of the app. */
export function useDrawingTheme(): DrawingTheme {
  theme ??= drawingTheme(tailwindConfig.theme.extend.colors as unknown as ThemeColours)
  return theme
}
