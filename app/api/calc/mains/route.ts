// Public: bus peak, stored energy and charge, discharge time, a suggested bleeder and the
// V(t) curve for a rectified mains bus. Request and response shapes: lib/validations/calc.ts.
import { calculateMains } from "@/lib/engineering/calculators";
import { handleJsonPost } from "@/lib/http/json";
import { mainsCalcSchema } from "@/lib/validations/calc";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(request, mainsCalcSchema, calculateMains, { route: "api/calc/mains" });
}
