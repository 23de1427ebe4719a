// Public: primary turns from the EMF equation (sine/square) or volt-seconds (forward), and
// the secondary turns and ratio. Shapes: lib/validations/calc.ts.
import { calculateTransformer } from "@/lib/engineering/calculators";
import { handleJsonPost } from "@/lib/http/json";
import { transformerCalcSchema } from "@/lib/validations/calc";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(request, transformerCalcSchema, calculateTransformer, { route: "api/calc/transformer" });
}
