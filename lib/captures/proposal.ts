import { convertUnit, unitQuantity, type Quantity } from "@/lib/engineering";
import type { PulseMeasurement } from "@/lib/engineering/waveform";
import { figureRow, figureUnit, figureValue, withPulseWidth, type FigureKey } from "./figures";

// Which measured figure a checkpoint asks for, read from its unit and its words, and that figure
// proposed as the reading's value in the checkpoint's unit. Pure: the capture card shows it, and
// the confirming server action works it out again from the stored figures (never from the form).

export type CheckpointFacts = { name: string; measure: string; unit: string };

export type ProposalChannel = { name: string; unit: string | null; figures: PulseMeasurement };

export type ChannelProposal = {
  channel: number;
  channelName: string;
  figure: FigureKey;
  figureLabel: string;
  /** the figure as measured, in its own unit (Hz, s, %, or the channel's unit) */
  measured: number;
  measuredUnit: string;
  /** the figure in the checkpoint's unit: the value the reading would get */
  value: number;
  unit: string;
};

export type Proposal =
  | { ok: true; figure: FigureKey; options: ChannelProposal[] }
  | { ok: false; figure: FigureKey | null; reason: string };

function quantityOf(unit: string | null | undefined): Quantity | null {
  if (!unit) return null;
  try {
    return unitQuantity(unit);
  } catch {
    return null;
  }
}

const has = (text: string, pattern: RegExp) => pattern.test(text);

/**
 * The figure a checkpoint measures, or null when a capture cannot give it (a temperature, a
 * current into a load read on a meter). Frequency and level units decide alone; a time or a
 * percentage needs the word that says which one (duty, rise, overshoot …).
 */
export function figureForCheckpoint(checkpoint: CheckpointFacts): FigureKey | null {
  const quantity = quantityOf(checkpoint.unit);
  const text = `${checkpoint.name} ${checkpoint.measure}`.toLowerCase();
  switch (quantity) {
    case "frequency":
      return "frequencyHz";
    case "ratio":
      if (has(text, /\bduty\b/)) return "dutyCyclePct";
      if (has(text, /\bovershoot\b/)) return "overshootPct";
      if (has(text, /\bundershoot\b/)) return "undershootPct";
      return null;
    case "time":
      if (has(text, /\brise\b|\brising edge\b/)) return "riseTimeS";
      if (has(text, /\bfall\b|\bfalling edge\b/)) return "fallTimeS";
      if (has(text, /\bpulse width\b|\bon[- ]time\b|\bpulse duration\b/)) return "pulseWidthS";
      if (has(text, /\bperiod\b/)) return "periodS";
      return null;
    case "voltage":
    case "current":
      if (has(text, /\bamplitude\b|peak[- ]to[- ]peak|\bpk-pk\b|\bp-p\b|\bswing\b/)) return "amplitudeV";
      if (has(text, /\blow(?:[- ]state)? level\b|\boff[- ]state\b|\blow state\b|\bnegative\b/)) return "lowV";
      // A level of a pulse signal (gate drive at 15 V) or a flat trace (a DC bus) reads as its high state.
      return "highV";
    default:
      return null;
  }
}

/** Whether a channel's samples can stand for the checkpoint's quantity (a level needs a matching probe unit). */
function channelFits(figure: FigureKey, channelUnit: string | null, checkpointQuantity: Quantity | null): boolean {
  if (figureRow(figure).unit !== "level") return true;
  // A channel without a unit is taken as volts, as scopes write them.
  const channelQuantity = channelUnit ? quantityOf(channelUnit) : "voltage";
  return channelQuantity !== null && channelQuantity === checkpointQuantity;
}

const WORDS: Record<FigureKey, string> = {
  lowV: "a low state level",
  highV: "a high state level",
  amplitudeV: "an amplitude",
  frequencyHz: "a frequency",
  periodS: "a period",
  pulseWidthS: "a pulse width",
  dutyCyclePct: "a duty cycle",
  riseTimeS: "a rise time",
  fallTimeS: "a fall time",
  overshootPct: "an overshoot",
  undershootPct: "an undershoot",
};

/**
 * The proposed value for the reading from each channel that measured the checkpoint's figure,
 * the first channel first; or why there is none.
 */
export function proposeReading(checkpoint: CheckpointFacts, channels: readonly ProposalChannel[]): Proposal {
  const figure = figureForCheckpoint(checkpoint);
  if (figure === null) {
    return { ok: false, figure, reason: `A capture gives pulse figures; this checkpoint is read in ${checkpoint.unit}, which none of them is.` };
  }
  const row = figureRow(figure);
  const checkpointQuantity = quantityOf(checkpoint.unit);
  const options: ChannelProposal[] = [];
  let unitMismatch = false;
  const reasons: string[] = [];
  channels.forEach((channel, index) => {
    if (!channelFits(figure, channel.unit, checkpointQuantity)) {
      unitMismatch = true;
      return;
    }
    const measured = figureValue(withPulseWidth(channel.figures), figure);
    if (measured === null) {
      if (channel.figures.reason) reasons.push(`${channel.name}: ${channel.figures.reason}`);
      return;
    }
    const measuredUnit = figureUnit(row, channel.unit);
    let value: number;
    try {
      value = convertUnit(measured, measuredUnit, checkpoint.unit);
    } catch {
      return;
    }
    options.push({ channel: index, channelName: channel.name, figure, figureLabel: row.label, measured, measuredUnit, value, unit: checkpoint.unit });
  });
  if (options.length > 0) return { ok: true, figure, options };
  if (unitMismatch && reasons.length === 0) {
    return { ok: false, figure, reason: `This checkpoint needs ${WORDS[figure]} in ${checkpoint.unit}, but no channel of the capture is recorded in a unit of that quantity.` };
  }
  const why = reasons.length > 0 ? ` ${reasons.join(" ")}` : "";
  return { ok: false, figure, reason: `No channel of the capture gave ${WORDS[figure]}.${why}` };
}

/** The option for one channel, or null when that channel has none (the confirming action's check). */
export function proposalForChannel(proposal: Proposal, channel: number): ChannelProposal | null {
  if (!proposal.ok) return null;
  return proposal.options.find((o) => o.channel === channel) ?? null;
}
