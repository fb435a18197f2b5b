import { onBeforeRouteLeave } from 'vue-router'

export const LEAVE_MESSAGE = 'This circuit has changes that are not saved yet. Leave anyway? (A copy stays in this browser.)'

/**
 * Asks before the page is closed, reloaded or left for another page of the app while `shouldWarn()`
 * holds (unsaved changes, or a save still on its way).
 */
export function useLeaveGuard(shouldWarn: () => boolean) {
  const onBeforeUnload = (e: BeforeUnloadEvent) => {
    if (!shouldWarn()) return
    e.preventDefault()
    // older browsers show the prompt only when returnValue is set
    e.returnValue = LEAVE_MESSAGE
  }
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload))
  onBeforeRouteLeave(() => (shouldWarn() ? window.confirm(LEAVE_MESSAGE) : true))
}
