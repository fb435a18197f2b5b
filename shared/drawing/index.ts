// Pure view geometry of the editor: projections, viewport maths, grid, symbols, hit tests and the
// SVG export. No DOM or canvas here; the Konva views and the export both build on it.
export * from './projection'
export * from './viewport'
export * from './grid'
export * from './symbols'
export * from './portMarkers'
export * from './hoseGeometry'
export * from './scene'
export * from './hitTest'
export * from './theme'
export * from './flow'
export * from './svg'
