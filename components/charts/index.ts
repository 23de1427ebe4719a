// Small SVG charts of our own (no chart package); they render on the server and in the browser.
export { DischargePlot, type DischargePlotProps } from "./discharge-plot";
export { FluxPlot, type FluxPlotProps } from "./flux-plot";
export {
  LineChart,
  type ChartAxis,
  type ChartMarker,
  type ChartPoint,
  type ChartSeries,
  type ChartTone,
  type LineChartProps,
} from "./line-chart";
export { LoadLinePlot, type LoadLinePlotProps, type LoadLinePoint } from "./load-line-plot";
export {
  axisExponent,
  linePath,
  linearScale,
  niceStep,
  niceTicks,
  sampleEvenly,
  tickLabels,
  type NiceTicks,
} from "./scale";
