/**
 * Command-line door to the solver: `npm run solve -- model.json [--json] [--currents] [--pattern]`.
 * Bad input exits with status 2 and one line naming the problem; no stack traces for user errors.
 */
import { readFileSync } from "node:fs";
import { solveResultJson, solveResultText } from "./cli-format";
import { solveModel } from "./index";
import { ModelError } from "./model/errors";
import { parseWireModel } from "./model/schema";
import { isPlanDocument, planReportJson, planReportText } from "./plan/cli-report";
import { parsePlan } from "./plan/schema";

const USAGE = "usage: npm run solve -- <model-or-plan.json> [--json] [--currents] [--pattern]";

function fail(message: string, code = 2): never {
  process.stderr.write(`${message}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  const flags = new Set(argv.filter((a) => a.startsWith("--")));
  const files = argv.filter((a) => !a.startsWith("--"));
  for (const f of flags)
    if (!["--json", "--currents", "--pattern", "--help"].includes(f)) fail(`unknown option ${f}\n${USAGE}`);
  if (flags.has("--help")) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (files.length !== 1) fail(USAGE);
  const file = files[0];
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    fail(`${file}: cannot read (${(e as NodeJS.ErrnoException).code ?? "error"})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    fail(`${file}: not valid JSON (${(e as Error).message})`);
  }
  try {
    if (isPlanDocument(json)) {
      const plan = parsePlan(json);
      const out = flags.has("--json") ? JSON.stringify(planReportJson(plan), null, 2) : planReportText(plan);
      process.stdout.write(`${out}\n`);
      return;
    }
    const model = parseWireModel(json);
    const result = solveModel(model, { keepPattern: flags.has("--pattern") });
    const out = flags.has("--json")
      ? JSON.stringify(solveResultJson(result, flags.has("--currents"), flags.has("--pattern")), null, 2)
      : solveResultText(result);
    process.stdout.write(`${out}\n`);
  } catch (e) {
    if (e instanceof ModelError) fail(`${file}: ${e.message}`);
    // Anything else is our bug, not the user's: say so plainly, still on one line.
    fail(`${file}: internal error: ${(e as Error).message}`, 1);
  }
}

main(process.argv.slice(2));
