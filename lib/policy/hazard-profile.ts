import {
  EngineeringInputError,
  busPeakVoltage,
  capacitorCharge,
  capacitorEnergy,
  dischargeTime,
  noLoadVoltageLimit,
  type NoLoadVoltageLimit,
  type OutputKind,
  type WeldingEnvironment,
} from "@/lib/engineering";
import { requireNonNegative, requirePositive, requireRange } from "@/lib/engineering/errors";
import { CURRENT_POLICY_REVISION, type PolicyRevision, type TopicCondition } from "./revisions";
import { SAFETY_TOPIC_KEYS, type SafetyTopicKey } from "./topics";

/** Where a listing sits in the finished build, as the seller declares it. */
export interface SafetyDeclaration {
  mainsConnected: boolean;
  /** nominal mains voltage, V RMS; required when mainsConnected, ignored otherwise (no mains, no bus) */
  mainsVrms?: number;
  /** fraction above nominal, 0.1 (IEC 60038's +10 %) by default */
  mainsTolerance?: number;
  busCapacitanceF?: number;
  /** absent or 0: no bleeder fitted */
  bleederOhm?: number;
  liveHeatsinks: boolean;
  weldingSource: boolean;
  /** DC: the peak; AC: the RMS value (the way AC sources are rated) */
  openCircuitV?: number;
  ocvKind?: OutputKind;
  environment?: WeldingEnvironment;
}

export interface HazardProfile {
  busPeakV: number;
  storedEnergyJ: number;
  storedChargeC: number;
  /** to the revision's safe voltage through the bleeder; null when there is no bleeder */
  dischargeS: number | null;
  /** the limit in the same terms as openCircuitV (peak for DC, RMS for AC); null unless welding */
  ocvLimitV: number | null;
  requiredTopics: SafetyTopicKey[];
  /** the rest of the picture, for display */
  capacitanceF: number;
  bleederOhm: number | null;
  safeVoltageV: number;
  ocv: {
    declaredV: number | null;
    kind: OutputKind;
    environment: WeldingEnvironment;
    basis: "peak" | "rms";
    limit: NoLoadVoltageLimit;
    /** null when no OCV was declared */
    withinLimit: boolean | null;
  } | null;
}

function ocvFigures(declaration: SafetyDeclaration): NonNullable<HazardProfile["ocv"]> {
  const kind = declaration.ocvKind ?? "dc";
  const environment = declaration.environment ?? "normal";
  const limit = noLoadVoltageLimit({ kind, environment });
  const basis = kind === "ac" ? "rms" : "peak";
  const limitV = basis === "rms" ? (limit.rmsV ?? limit.peakV) : limit.peakV;
  const declaredV = declaration.openCircuitV ?? null;
  if (declaredV !== null && (!Number.isFinite(declaredV) || declaredV < 0)) {
    throw new EngineeringInputError("openCircuitV", "openCircuitV must be a finite number of volts, not negative.");
  }
  return {
    declaredV,
    kind,
    environment,
    basis,
    limit,
    withinLimit: declaredV === null ? null : declaredV <= limitV,
  };
}

/** The figures of the listing's own declaration that decide which safety topics it needs. */
export function hazardProfile(
  declaration: SafetyDeclaration,
  revision: PolicyRevision = CURRENT_POLICY_REVISION,
): HazardProfile {
  let busPeakV = 0;
  if (declaration.mainsConnected) {
    if (declaration.mainsVrms === undefined) {
      throw new EngineeringInputError("mainsVrms", "State the nominal mains voltage of a mains-connected item.");
    }
    busPeakV = busPeakVoltage(
      requirePositive("mainsVrms", declaration.mainsVrms),
      requireRange("mainsTolerance", declaration.mainsTolerance ?? 0.1, 0, 1),
    );
  }
  const capacitanceF = requireNonNegative("busCapacitanceF", declaration.busCapacitanceF ?? 0);
  const bleederOhm = requireNonNegative("bleederOhm", declaration.bleederOhm ?? 0) || null;
  const storedEnergyJ = capacitorEnergy(capacitanceF, busPeakV);
  const storedChargeC = capacitorCharge(capacitanceF, busPeakV);

  let dischargeS: number | null = null;
  if (bleederOhm !== null) {
    dischargeS =
      capacitanceF > 0
        ? dischargeTime({ resistanceOhm: bleederOhm, capacitanceF, fromV: busPeakV, toV: revision.safeVoltageV })
        : 0;
  }

  const ocv = declaration.weldingSource ? ocvFigures(declaration) : null;
  const ocvLimitV = ocv ? (ocv.basis === "rms" ? (ocv.limit.rmsV ?? ocv.limit.peakV) : ocv.limit.peakV) : null;

  const holds: Record<TopicCondition, boolean> = {
    always: true,
    "mains-connected": declaration.mainsConnected,
    "stored-charge": busPeakV > revision.safeVoltageV && storedChargeC > revision.storedChargeThresholdC,
    "live-heatsinks": declaration.liveHeatsinks,
    "welding-source": declaration.weldingSource,
  };
  const required = new Set(revision.topicRules.filter((rule) => holds[rule.when]).map((rule) => rule.topic));
  // Every listing needs the local-codes topic, whatever a revision's rules say.
  required.add("codes-and-competence");

  return {
    busPeakV,
    storedEnergyJ,
    storedChargeC,
    dischargeS,
    ocvLimitV,
    requiredTopics: SAFETY_TOPIC_KEYS.filter((key) => required.has(key)),
    capacitanceF,
    bleederOhm,
    safeVoltageV: revision.safeVoltageV,
    ocv,
  };
}
