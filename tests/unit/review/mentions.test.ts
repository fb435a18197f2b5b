import { describe, expect, it } from 'vitest'
import { mentionQueryAt, mentionSuggestions, resolveMentions, type Mentionable } from '#shared/review'

const members: Mentionable[] = [
  { id: 'u1', name: 'Ada Marsh', email: 'ada@shop.test' },
  { id: 'u2', name: 'Adam Rook', email: 'rook@shop.test' },
  { id: 'u3', name: 'Tove', email: 'tove.lind@shop.test' },
]

describe('resolving @mentions', () => {
  it('takes the longest name that follows, case-insensitively, up to a word boundary', () => {
    expect(resolveMentions('@ada marsh please check the top hose', members)).toEqual(['u1'])
    expect(resolveMentions('@Adam Rook and @Ada Marsh', members)).toEqual(['u2', 'u1'])
    // "@Ada" alone is Ada (her handle); "@Adamant" is nobody
    expect(resolveMentions('ask @Ada.', members)).toEqual(['u1'])
    expect(resolveMentions('@Adamant', members)).toEqual([])
  })

  it('knows people by their e-mail handle too, and lists each once', () => {
    expect(resolveMentions('@rook @tove.lind @Tove', members)).toEqual(['u2', 'u3'])
  })

  it('ignores e-mail addresses and unknown names', () => {
    expect(resolveMentions('write to ada@shop.test or @nobody', members)).toEqual([])
  })
})

describe('the composer’s autocomplete', () => {
  it('finds the partial name before the caret', () => {
    expect(mentionQueryAt('see @ad', 7)).toEqual({ start: 4, query: 'ad' })
    expect(mentionQueryAt('mail ada@sh', 11)).toBeNull()
    expect(mentionQueryAt('no mention', 10)).toBeNull()
  })

  it('suggests names starting with it first, then any word, then handles', () => {
    expect(mentionSuggestions('ad', members).map((m) => m.id)).toEqual(['u1', 'u2'])
    expect(mentionSuggestions('ro', members).map((m) => m.id)).toEqual(['u2'])
    expect(mentionSuggestions('tove.', members).map((m) => m.id)).toEqual(['u3'])
  })
})
