import type { CommentItem } from '#shared/schemas/comment'

/**
 * The open circuit's comment threads, shared by the comment panel (which loads them) and the views
 * (which pin them to the drawing), and the thread a clicked pin or a mention link brings forward.
 */
export function useEditorComments() {
  const comments = useState<CommentItem[]>('editor-comments', () => [])
  const focusId = useState<string | null>('editor-comment-focus', () => null)
  return { comments, focusId }
}
