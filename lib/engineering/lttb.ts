// Largest-Triangle-Three-Buckets (S. Steinarsson, "Downsampling Time Series for Visual
// Representation", University of Iceland, 2013): keeps the first and last points and, from each
// bucket between them, the point that forms the largest triangle with the point kept before it and
// the average of the next bucket — so peaks and edges of a long capture survive on a plot.
import { EngineeringInputError, isNumberList } from "./errors";

export type DownsampledTrace = { timeS: Float64Array; values: Float64Array; indices: Uint32Array };

/** Bucket bounds follow the thesis's reference implementation, so results match it point for point. */
export function downsampleForPlot(timeS: ArrayLike<number>, values: ArrayLike<number>, targetPoints: number): DownsampledTrace {
  if (!isNumberList(timeS) || !isNumberList(values)) {
    throw new EngineeringInputError("values", "downsampleForPlot needs arrays of times and values.");
  }
  if (timeS.length !== values.length) {
    throw new EngineeringInputError("values", `timeS has ${timeS.length} samples but values has ${values.length}; they must match.`);
  }
  if (!Number.isInteger(targetPoints) || targetPoints < 2) {
    throw new EngineeringInputError("targetPoints", "targetPoints must be a whole number of at least 2.");
  }
  const n = values.length;
  for (let i = 0; i < n; i += 1) {
    if (!Number.isFinite(timeS[i]) || !Number.isFinite(values[i])) {
      throw new EngineeringInputError(Number.isFinite(timeS[i]) ? "values" : "timeS", `Sample ${i} is not a finite number.`);
    }
  }
  if (targetPoints >= n) return pick(timeS, values, Uint32Array.from({ length: n }, (_, i) => i));

  const indices = new Uint32Array(targetPoints);
  const every = (n - 2) / (targetPoints - 2);
  let a = 0;
  indices[0] = 0;
  for (let bucket = 0; bucket < targetPoints - 2; bucket += 1) {
    // The average point of the next bucket (the last bucket's "next" is the final point).
    let avgStart = Math.floor((bucket + 1) * every) + 1;
    const avgEnd = Math.min(Math.floor((bucket + 2) * every) + 1, n);
    const avgLength = avgEnd - avgStart;
    let avgT = 0;
    let avgV = 0;
    for (; avgStart < avgEnd; avgStart += 1) {
      avgT += timeS[avgStart]!;
      avgV += values[avgStart]!;
    }
    avgT /= avgLength;
    avgV /= avgLength;

    const from = Math.floor(bucket * every) + 1;
    const to = Math.floor((bucket + 1) * every) + 1;
    const at = timeS[a]!;
    const av = values[a]!;
    let maxArea = -1;
    let chosen = from;
    for (let i = from; i < to; i += 1) {
      const area = Math.abs((at - avgT) * (values[i]! - av) - (at - timeS[i]!) * (avgV - av)) * 0.5;
      if (area > maxArea) {
        maxArea = area;
        chosen = i;
      }
    }
    indices[bucket + 1] = chosen;
    a = chosen;
  }
  indices[targetPoints - 1] = n - 1;
  return pick(timeS, values, indices);
}

function pick(timeS: ArrayLike<number>, values: ArrayLike<number>, indices: Uint32Array): DownsampledTrace {
  const t = new Float64Array(indices.length);
  const v = new Float64Array(indices.length);
  for (let k = 0; k < indices.length; k += 1) {
    t[k] = timeS[indices[k]!]!;
    v[k] = values[indices[k]!]!;
  }
  return { timeS: t, values: v, indices };
}

