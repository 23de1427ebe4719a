import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CORE_MATERIAL_IDS } from "@/lib/engineering/materials";
import { SAFETY_TOPIC_KEYS } from "@/lib/policy/topics";
import { CALC_LIMITS } from "@/lib/validations/calc";
import { hostileValue, malformedJson, toJsonText, wrongShape } from "./bad-input";
import { callRoute, expectRefusal, fuzz } from "./call-route";

// The public calculators and the live safety-sheet check compute and store nothing, so they can be
// fuzzed with bodies that are *nearly* valid as well: every field of a valid example kept, moved
// to its validated bounds or just past them, set to an extreme number, replaced by something
// hostile, or dropped. Whatever arrives, the answer is 200 with a result or a clear 4xx; a throw
// inside the engineering code surfacing as a 500 is the failure this looks for. Each route's
// example must itself give 200, or the fuzz would circle an input that is refused anyway.

const RUNS = 100;

const material = CORE_MATERIAL_IDS[0];

const TARGETS: { file: string; example: Record<string, unknown> }[] = [
  { file: "calc/mains/route.ts", example: { mainsVrms: 230, tolerance: 0.1, capacitanceF: 470e-6, bleederOhm: 100_000, safeV: 60, targetDischargeS: 60, points: 60 } },
  { file: "calc/inductor/route.ts", example: { method: "al", alNh: 250, turns: 20, coreAreaM2: 1e-4, material, ratedCurrentA: 10, points: 50 } },
  { file: "calc/inductor/route.ts", example: { method: "gap", turns: 20, coreAreaM2: 1e-4, gapM: 1e-3, pathM: 0.1, relativePermeability: 2000, material, ratedCurrentA: 10, points: 50 } },
  { file: "calc/transformer/route.ts", example: { mode: "sine", primaryV: 325, frequencyHz: 50_000, peakFluxT: 0.2, coreAreaM2: 1e-4, secondaryV: 24 } },
  { file: "calc/transformer/route.ts", example: { mode: "forward", busVolts: 325, onTimeS: 1e-5, fluxSwingT: 0.2, coreAreaM2: 1e-4, secondaryV: 24 } },
  { file: "calc/winding/route.ts", example: { material: "copper", lengthM: 10, currentA: 10, temperatureC: 20, frequencyHz: 50_000, strands: 1, awg: 14 } },
  { file: "calc/winding/route.ts", example: { material: "aluminium", lengthM: 10, currentA: 10, temperatureC: 90, strands: 20, areaM2: 1e-7 } },
  {
    file: "calc/welding-output/route.ts",
    example: { process: "mma", openCircuitV: 70, ocvKind: "dc", environment: "normal", ratedA: 140, ratedDutyPct: 60, targetDutyPct: 100, maxCurrentA: 160, points: 40 },
  },
  {
    file: "policy/check/route.ts",
    example: {
      declaration: {
        mainsConnected: true,
        mainsVrms: 230,
        mainsTolerance: 0.1,
        busCapacitanceF: 470e-6,
        bleederOhm: 100_000,
        liveHeatsinks: true,
        weldingSource: true,
        openCircuitV: 70,
        ocvKind: "dc",
        environment: "normal",
      },
      notes: SAFETY_TOPIC_KEYS.slice(0, 3).map((topic) => ({ topic, text: "Unplug, wait for the bleeder, then measure the bus with a meter before touching.", waitSeconds: 120 })),
    },
  },
];

const limits = Object.values(CALC_LIMITS).flatMap(({ min, max }) => [min, max]);

/** Numbers a calculator must either compute with or refuse: the validated bounds and just past them, extremes, subnormals. */
const edgeNumber: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(...limits),
  fc.constantFrom(...limits).map((v) => v * (1 + 1e-12)),
  fc.constantFrom(...limits).map((v) => v * (1 - 1e-12)),
  fc.constantFrom(...limits).map((v) => v - Number.EPSILON),
  fc.constantFrom(0, -0, -1, 5e-324, 2.2250738585072014e-308, 1e-300, 1e300, Number.MAX_SAFE_INTEGER, 0.1 + 0.2),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.double({ min: 1e-9, max: 1e6, noNaN: true }),
  fc.integer({ min: -10, max: 10_000 }),
);

function perturbed(value: unknown): fc.Arbitrary<unknown> {
  if (Array.isArray(value)) return fc.oneof(fc.constant(value), fc.tuple(...value.map(perturbed)), hostileValue);
  if (value && typeof value === "object") return nearly(value as Record<string, unknown>);
  return fc.oneof({ weight: 3, arbitrary: fc.constant(value) }, { weight: 3, arbitrary: edgeNumber }, { weight: 1, arbitrary: hostileValue }, { weight: 1, arbitrary: fc.constant(undefined) });
}

/** The example with each field kept, moved to an edge, made hostile or dropped. */
function nearly(example: Record<string, unknown>): fc.Arbitrary<Record<string, unknown>> {
  return fc.record(Object.fromEntries(Object.entries(example).map(([key, value]) => [key, perturbed(value)])));
}

describe.each(TARGETS.map((t) => [`POST app/api/${t.file} (${String(t.example.method ?? t.example.mode ?? t.example.material ?? "")})`, t] as const))("%s", (name, target) => {
  it("computes the valid example", async () => {
    const response = await callRoute(target.file, "POST", { body: JSON.stringify(target.example) });
    expect(response.status, await response.clone().text()).toBe(200);
  });

  it("answers nearly valid, hostile and malformed bodies with 200 or a clear 4xx, never a 500", async () => {
    const body = fc.oneof(
      { weight: 6, arbitrary: nearly(target.example).map(toJsonText) },
      { weight: 1, arbitrary: wrongShape.map(toJsonText) },
      { weight: 1, arbitrary: malformedJson },
    );
    await fuzz(
      body,
      async (text) => {
        const context = `${name} with ${text.slice(0, 300)}`;
        const response = await callRoute(target.file, "POST", { body: text });
        if (response.status === 200) {
          expect(response.headers.get("content-type") ?? "", context).toMatch(/application\/json/);
          await response.json();
          return;
        }
        const refusal = await expectRefusal(response, context);
        expect([413, 422], context).toContain(refusal.status);
      },
      RUNS,
    );
  });
});
