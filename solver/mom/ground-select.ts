/**
 * Which ground kernel runs the fill, and what the far field is told about the ground.
 * Free space and perfect ground live here; a real (lossy) ground is built by the factory passed in
 * (solver/ground/ owns it), so this file needs no change when that method lands.
 */
import type { FarFieldGround } from "../fields/types";
import { freeSpaceGround } from "../ground/free";
import type { GroundKernel, GroundSetup } from "../ground/kernel";
import { perfectGround } from "../ground/perfect";
import { resolveRealGround } from "../ground/presets";
import { ModelError } from "../model/errors";
import type { GroundInput } from "../model/types";

export type RealGroundFactory = (
  setup: GroundSetup,
  ground: ReturnType<typeof resolveRealGround>,
) => GroundKernel;

export function selectGround(
  input: GroundInput,
  setup: GroundSetup,
  realFactory?: RealGroundFactory,
): { kernel: GroundKernel; farField: FarFieldGround } {
  switch (input.kind) {
    case "free":
      return { kernel: freeSpaceGround(), farField: { kind: "free" } };
    case "perfect":
      return { kernel: perfectGround(setup), farField: { kind: "perfect" } };
    case "real": {
      const g = resolveRealGround(input);
      if (!realFactory) {
        throw new ModelError(
          "ground",
          "real (lossy) ground is not available in this build yet; use free or perfect",
        );
      }
      return {
        kernel: realFactory(setup, g),
        farField: { kind: "real", permittivity: g.permittivity, conductivity: g.conductivity },
      };
    }
    default:
      throw new ModelError(
        "ground.kind",
        `unknown ground kind ${JSON.stringify((input as { kind: unknown }).kind)}`,
      );
  }
}
