// Public: the arc-welding standard's load line, the open-circuit voltage against its limit,
// and the current at another duty cycle. Shapes: lib/validations/calc.ts.
import { calculateWeldingOutput } from "@/lib/engineering/calculators";
import { handleJsonPost } from "@/lib/http/json";
import { weldingOutputCalcSchema } from "@/lib/validations/calc";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(request, weldingOutputCalcSchema, calculateWeldingOutput, { route: "api/calc/welding-output" });
}
