// The engineering core: pure functions in SI units, no I/O. Other areas import from here.
export { EngineeringInputError } from "./errors";
export { MU_0, SAFE_VOLTAGE_V, STORED_CHARGE_THRESHOLD_C } from "./constants";
export {
  CONDUCTOR_MATERIAL_IDS,
  CONDUCTOR_MATERIALS,
  CORE_MATERIAL_IDS,
  CORE_MATERIALS,
  type ConductorMaterial,
  type ConductorMaterialId,
  type CoreMaterial,
  type CoreMaterialId,
} from "./materials";
export {
  E12_SERIES,
  E24_SERIES,
  PREFERRED_SERIES,
  preferredValue,
  type PreferredDirection,
  type PreferredSeries,
  type PreferredValueOptions,
} from "./preferred-values";
export {
  busPeakVoltage,
  capacitorCharge,
  capacitorEnergy,
  dischargeCurve,
  dischargeTime,
  suggestBleeder,
  type BleederSuggestion,
  type DischargeCurveInput,
  type DischargePoint,
  type DischargeTimeInput,
  type SuggestBleederInput,
} from "./mains";
export {
  fluxCurve,
  gappedInductance,
  inductanceFromAl,
  peakFluxDensity,
  saturationCurrent,
  storedEnergy,
  turnsForInductance,
  type FluxCurveInput,
  type FluxPoint,
  type GappedInductanceInput,
  type InductanceFromAlInput,
  type PeakFluxDensityInput,
  type SaturationCurrentInput,
  type StoredEnergyInput,
  type TurnsForInductanceInput,
} from "./magnetics";
export {
  WAVEFORM_FACTORS,
  forwardTurns,
  transformerTurns,
  type ForwardTurnsInput,
  type TransformerTurnsInput,
  type Waveform,
} from "./transformer";
export {
  awgDiameter,
  awgNumber,
  conductorResistance,
  conductorResistivity,
  currentDensity,
  skinDepth,
  type AwgGauge,
  type ConductorResistanceInput,
  type CurrentDensityInput,
  type SkinDepthInput,
} from "./conductors";
export {
  WELDING_PROCESSES,
  conventionalLoadVoltage,
  currentAtDutyCycle,
  noLoadVoltageLimit,
  type DutyCycleInput,
  type NoLoadVoltageLimit,
  type NoLoadVoltageLimitInput,
  type OutputKind,
  type WeldingEnvironment,
  type WeldingProcess,
} from "./welding";
export { SUPPORTED_UNITS, convertUnit, unitQuantity, type Quantity } from "./units";
export {
  FAR_OUTSIDE_FRACTION,
  classifyReading,
  type ClassifyReadingInput,
  type ReadingClassification,
  type ReadingVerdict,
} from "./readings";
export {
  downsampleForPlot,
  measurePulses,
  parseCaptureCsv,
  type CaptureChannel,
  type DownsampledTrace,
  type ParsedCapture,
  type PulseInput,
  type PulseMeasurement,
} from "./waveform";
