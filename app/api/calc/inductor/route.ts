// Public: inductance by AL or by gap geometry, peak flux at the rated current, margin to the
// core material's saturation and the B-vs-I series. Shapes: lib/validations/calc.ts.
import { calculateInductor } from "@/lib/engineering/calculators";
import { handleJsonPost } from "@/lib/http/json";
import { inductorCalcSchema } from "@/lib/validations/calc";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(request, inductorCalcSchema, calculateInductor, { route: "api/calc/inductor" });
}
