/** Pads or die outline that cannot make a pad table; the message says why. */
export class PadTableInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PadTableInputError";
  }
}
