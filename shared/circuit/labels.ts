import type { ClampKind, HoseMaterial } from './hose'

// Words people read for the model's codes, shared by the editor, the shop outputs, the PDF and the
// CLI so "j20-r3-heater" never reaches a page. Plain words first, the SAE class in brackets for
// ordering (class descriptions from memory).
export const hoseMaterialNames: Record<HoseMaterial, string> = {
  'j20-r3-heater': 'Heater hose, reinforced rubber (SAE J20 R3)',
  'j20-r4-radiator': 'Radiator hose, wire-supported for bends (SAE J20 R4)',
  'silicone': 'Silicone coolant hose',
  'j30-r6': 'Fuel hose, low pressure (SAE J30 R6)',
  'j30-r7': 'Fuel hose, low pressure, injection returns (SAE J30 R7)',
  'j30-r9': 'Fuel-injection hose, high pressure (SAE J30 R9)',
  'j30-r10': 'In-tank fuel hose (SAE J30 R10)',
  'j30-r14': 'Low-permeation fuel hose (SAE J30 R14)',
  'ptfe-lined': 'PTFE-lined braided fuel hose',
  'hard-line': 'Hard line (rigid tube)',
}

export const clampKindNames: Record<ClampKind, string> = {
  'worm-drive': 'Worm-drive (screw band)',
  'spring': 'Spring band',
  'constant-tension': 'Constant-tension',
  't-bolt': 'T-bolt',
  'crimp': 'Crimp (ear) clamp',
  'efi-band': 'Smooth-band fuel-injection clamp',
  'none': 'None (hard line or push-on)',
}
