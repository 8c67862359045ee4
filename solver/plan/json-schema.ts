import { z } from "zod";
import { PlanSchema } from "./schema";

/** The plan format as JSON Schema (draft 2020-12), describing the document as written (defaults optional). */
export function planJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(PlanSchema, { io: "input", unrepresentable: "any" }) as Record<
    string,
    unknown
  >;
  return {
    ...schema,
    $id: "https://example.invalid/yard-antenna-planner/plan.schema.json",
    title: "Yard antenna plan",
    description:
      "A backyard HF wire-antenna plan: lot, supports, hazards and wire runs. Lengths in metres; x, y on the ground, z up.",
  };
}
