/** A request the physics cannot answer (impossible band, temperature, constants); its message is for people. */
export class CoreInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CoreInputError";
  }
}
