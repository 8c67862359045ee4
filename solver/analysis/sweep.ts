/** The frequency list of a model, in MHz, in the order given (a range is evenly spaced, ends included). */
import { ModelError } from "../model/errors";
import type { FrequencyInput } from "../model/types";

export function frequencyListMHz(input: FrequencyInput): number[] {
  let list: number[];
  if (Array.isArray(input)) {
    list = input.slice();
  } else {
    const { from, to, count } = input;
    if (!(count >= 1) || !Number.isInteger(count)) {
      throw new ModelError("frequenciesMHz.count", `count must be a whole number ≥ 1 (got ${count})`);
    }
    list =
      count === 1 ? [from] : Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));
  }
  if (list.length === 0) throw new ModelError("frequenciesMHz", "no frequencies given");
  list.forEach((f, i) => {
    if (!(f > 0) || !Number.isFinite(f)) {
      throw new ModelError(`frequenciesMHz[${i}]`, `frequency must be a positive number of MHz (got ${f})`);
    }
  });
  return list;
}
