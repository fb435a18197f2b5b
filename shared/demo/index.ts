export { demoDocument, correctedDemoDocument } from './coolantCircuit'
export { randomCircuit, rungsFor, type RandomCircuitOptions } from './randomCircuit'
export { fuelDemoDocument, correctedFuelDemoDocument } from './fuelCircuit'
