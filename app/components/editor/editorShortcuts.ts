// Every keyboard shortcut of the editor, in one list: the keyboard handler matches events against it
// and the shortcut sheet (`?`) prints it, so the two cannot drift apart. "Ctrl" is Ctrl, or ⌘ on a Mac.

export interface KeyCombo {
  /** KeyboardEvent.key, e.g. 'z', 'Delete', 'ArrowLeft', '?' */
  key: string
  ctrl?: boolean
  shift?: boolean
  alt?: boolean
}

export type EditorShortcutId =
  | 'undo' | 'redo' | 'copy' | 'paste' | 'duplicate' | 'delete' | 'select-all' | 'clear-selection'
  | 'rotate' | 'rotate-back' | 'toggle-plug' | 'nudge' | 'nudge-far' | 'nudge-up' | 'nudge-down'
  | 'next-part' | 'previous-part' | 'zoom-in' | 'zoom-out' | 'frame-all' | 'save' | 'shortcuts'

export interface EditorShortcut {
  id: EditorShortcutId
  group: 'Edit' | 'Select' | 'Move' | 'View' | 'Help'
  /** what it does, in the sheet */
  action: string
  /** any of these triggers it */
  combos: KeyCombo[]
  /** how the sheet writes the keys when listing each combo would be long */
  keysText?: string
}

const arrows = (shift: boolean): KeyCombo[] => ['ArrowLeft', 'ArrowRight', 'ArrowUp', 'ArrowDown'].map((key) => ({ key, shift }))

export const editorShortcuts: readonly EditorShortcut[] = [
  { id: 'undo', group: 'Edit', action: 'Undo', combos: [{ key: 'z', ctrl: true }] },
  { id: 'redo', group: 'Edit', action: 'Redo', combos: [{ key: 'z', ctrl: true, shift: true }, { key: 'y', ctrl: true }] },
  { id: 'copy', group: 'Edit', action: 'Copy the selected parts and hoses', combos: [{ key: 'c', ctrl: true }] },
  { id: 'paste', group: 'Edit', action: 'Paste next to the originals', combos: [{ key: 'v', ctrl: true }] },
  { id: 'duplicate', group: 'Edit', action: 'Duplicate the selection', combos: [{ key: 'd', ctrl: true }] },
  { id: 'delete', group: 'Edit', action: 'Delete the selection (or the picked bend point)', combos: [{ key: 'Delete' }, { key: 'Backspace' }] },
  { id: 'toggle-plug', group: 'Edit', action: 'Plug or unplug the selected port', combos: [{ key: 'b' }] },
  { id: 'save', group: 'Edit', action: 'Save now (it also saves by itself)', combos: [{ key: 's', ctrl: true }] },
  { id: 'select-all', group: 'Select', action: 'Select every part and hose', combos: [{ key: 'a', ctrl: true }] },
  { id: 'clear-selection', group: 'Select', action: 'Clear the selection; close a dialog', combos: [{ key: 'Escape' }] },
  { id: 'next-part', group: 'Select', action: 'Select the next part and show it', combos: [{ key: ']' }] },
  { id: 'previous-part', group: 'Select', action: 'Select the previous part and show it', combos: [{ key: '[' }] },
  { id: 'rotate', group: 'Move', action: 'Turn the selected parts 90° about z', combos: [{ key: 'r' }] },
  { id: 'rotate-back', group: 'Move', action: 'Turn them 90° the other way', combos: [{ key: 'r', shift: true }] },
  { id: 'nudge', group: 'Move', action: 'Move the selection 1 mm in the focused view (nothing selected: pan)', combos: arrows(false), keysText: 'Arrow keys' },
  { id: 'nudge-far', group: 'Move', action: 'Move the selection 10 mm in the focused view', combos: arrows(true), keysText: 'Shift + arrow keys' },
  { id: 'nudge-up', group: 'Move', action: 'Raise the selection 10 mm', combos: [{ key: 'PageUp' }] },
  { id: 'nudge-down', group: 'Move', action: 'Lower the selection 10 mm', combos: [{ key: 'PageDown' }] },
  { id: 'zoom-in', group: 'View', action: 'Zoom the focused view in', combos: [{ key: '+' }, { key: '=' }] },
  { id: 'zoom-out', group: 'View', action: 'Zoom the focused view out', combos: [{ key: '-' }] },
  { id: 'frame-all', group: 'View', action: 'Fit the whole drawing in both views', combos: [{ key: 'f' }] },
  { id: 'shortcuts', group: 'Help', action: 'Show this list of shortcuts', combos: [{ key: '?', shift: true }] },
]

/** Typing in a field is text, not a command. */
export function isTypingTarget(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null
  if (!el || typeof el.tagName !== 'string') return false
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName)
}

function comboMatches(c: KeyCombo, e: KeyboardEvent): boolean {
  const ctrl = e.ctrlKey || e.metaKey
  // '?' needs Shift on most layouts, so Shift is not compared for printable symbols
  const symbol = c.key.length === 1 && !/[a-z0-9]/i.test(c.key)
  return e.key.toLowerCase() === c.key.toLowerCase() && ctrl === (c.ctrl ?? false) && e.altKey === (c.alt ?? false)
    && (symbol || e.shiftKey === (c.shift ?? false))
}

/** The shortcut a key press stands for, or null. */
export function matchShortcut(e: KeyboardEvent): EditorShortcut | null {
  return editorShortcuts.find((s) => s.combos.some((c) => comboMatches(c, e))) ?? null
}

/** "Ctrl + Shift + Z" */
export function comboText(c: KeyCombo): string {
  const NAMES: Record<string, string> = { ArrowLeft: '←', ArrowRight: '→', ArrowUp: '↑', ArrowDown: '↓', Escape: 'Esc', Delete: 'Del', PageUp: 'Page Up', PageDown: 'Page Down' }
  const key = NAMES[c.key] ?? (c.key.length === 1 ? c.key.toUpperCase() : c.key)
  const symbol = c.key.length === 1 && !/[a-z0-9]/i.test(c.key)
  return [c.ctrl && 'Ctrl', c.alt && 'Alt', c.shift && !symbol && 'Shift', key].filter(Boolean).join(' + ')
}
