// Scratch space for the temporary arrays of a solve. A typed array longer than a few dozen bytes gets
// its own off-heap buffer, and allocating one costs around a microsecond, as much as factorising a
// small network; so the setup's temporaries are carved out of shared buffers that are reused.
//
// Use it as a stack: `const mark = scratchMark()`, take arrays, `scratchRelease(mark)` before
// returning. Only for arrays that do not outlive that (the solver is synchronous, so nothing else
// runs in between). A buffer that is too small is replaced by a larger one; arrays taken earlier keep
// the old buffer and stay valid.

interface Pool<T> {
  buffer: T
  used: number
  /** bumped whenever the buffer is replaced */
  generation: number
}

const ints: Pool<Int32Array> = { buffer: new Int32Array(1 << 14), used: 0, generation: 0 }
const reals: Pool<Float64Array> = { buffer: new Float64Array(1 << 12), used: 0, generation: 0 }

export interface ScratchMark {
  intsUsed: number
  intsGeneration: number
  realsUsed: number
  realsGeneration: number
}

export function scratchMark(): ScratchMark {
  return { intsUsed: ints.used, intsGeneration: ints.generation, realsUsed: reals.used, realsGeneration: reals.generation }
}

export function scratchRelease(mark: ScratchMark): void {
  // after a replacement, everything in the new buffer was taken after the mark
  ints.used = mark.intsGeneration === ints.generation ? mark.intsUsed : 0
  reals.used = mark.realsGeneration === reals.generation ? mark.realsUsed : 0
}

/** `size` Int32 slots, zero-filled. */
export function takeInts(size: number): Int32Array {
  if (ints.used + size > ints.buffer.length) {
    ints.buffer = new Int32Array(Math.max(2 * ints.buffer.length, 2 * size))
    ints.used = 0
    ints.generation++
  }
  const out = ints.buffer.subarray(ints.used, ints.used + size)
  ints.used += size
  return out.fill(0)
}

/** `size` Float64 slots, zero-filled. */
export function takeReals(size: number): Float64Array {
  if (reals.used + size > reals.buffer.length) {
    reals.buffer = new Float64Array(Math.max(2 * reals.buffer.length, 2 * size))
    reals.used = 0
    reals.generation++
  }
  const out = reals.buffer.subarray(reals.used, reals.used + size)
  reals.used += size
  return out.fill(0)
}
