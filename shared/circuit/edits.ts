// Every change to a circuit document is a pure function (doc, args) → new doc: the editor store, the
// one-click fixes and the tests all use these. Inputs are never mutated; unchanged parts of the
// document are shared with the result. Every result passes parseCircuitDocument as long as the
// values in a patch are ones the schema accepts (tests/unit/edits check this on random sequences).
export { placeComponent, moveComponents, setComponentPosition, rotateComponent, updateComponent, updatePort, addPort, addPortAt, removePort } from './editParts'
export type { ComponentPatch, PortPatch, NewPort } from './editParts'
export { addHose, setHoseEnd, addRoutePoint, moveRoutePoint, removeRoutePoint, updateHose, boreForSpigots, hoseDefaultsFor, middleBend } from './editHoses'
export type { EndTarget, HoseOptions, HosePatch } from './editHoses'
export { deleteElements, extractElements, insertElements, duplicateElements, updateSettings, updateCircuitText, clipboardBundle, CLIPBOARD_FORMAT } from './editElements'
export type { ElementBundle } from './editElements'
export { applyFix } from './editFixes'
export type { FixResult } from './editFixes'
export type { EndName } from './editInternals'
export { emptyHistory, recordStep, undoStep, redoStep } from './editHistory'
export type { UndoEntry, UndoHistory } from './editHistory'
