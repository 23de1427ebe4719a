// Oscilloscope captures: reading CSV files, IEEE Std 181 pulse figures and plot downsampling.
export { parseCaptureCsv, type CaptureChannel, type ParsedCapture } from "./capture-csv";
export { measurePulses, type PulseInput, type PulseMeasurement } from "./pulse-measures";
export { downsampleForPlot, type DownsampledTrace } from "./lttb";
