// Calculator compositions behind /api/calc/*: validated input in, figures and plot series out.
export { calculateMains, type MainsResult } from "./mains";
export { calculateInductor, type InductorResult, type InductorVerdict } from "./inductor";
export { calculateTransformer, type TransformerResult } from "./transformer";
export { calculateWinding, type WindingResult } from "./winding";
export { calculateWeldingOutput, type LoadPoint, type WeldingOutputResult } from "./welding-output";
