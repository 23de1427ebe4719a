// Public: winding resistance at temperature, copper loss, current density, skin depth and AWG
// diameter. Shapes: lib/validations/calc.ts.
import { calculateWinding } from "@/lib/engineering/calculators";
import { handleJsonPost } from "@/lib/http/json";
import { windingCalcSchema } from "@/lib/validations/calc";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(request, windingCalcSchema, calculateWinding, { route: "api/calc/winding" });
}
