/** A problem with the user's input, with the path of the offending field (e.g. "wires[1].points[0]"). */
export class ModelError extends Error {
  readonly path: string;
  constructor(path: string, message: string) {
    super(path ? `${path}: ${message}` : message);
    this.name = "ModelError";
    this.path = path;
  }
}
