/**
 * Regenerates solver/plan/plan.schema.json from the zod schema: `npx tsx solver/plan/write-plan-schema.ts`.
 * A unit test checks that the checked-in file is current.
 */
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { planJsonSchema } from "./json-schema";

const out = fileURLToPath(new URL("./plan.schema.json", import.meta.url));
writeFileSync(out, `${JSON.stringify(planJsonSchema(), null, 2)}\n`);
console.log(`wrote ${out}`);
