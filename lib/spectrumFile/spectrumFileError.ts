/** A spectrum file that cannot be read; the message is one sentence that starts with the file name. */
export class SpectrumFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SpectrumFileError";
  }
}
